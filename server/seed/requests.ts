// Demo change requests for Kestrel Bay Toy Co. (invented), with simple before/after drawings made
// here from SVG (rendered by sharp to PNG), so the compare view has real images:
//  - the demo scenario: the head tool of "Ranger Kite" re-cut to add a raised visor ridge for the
//    derivative "Storm Kite". Steel comes out, so the cut cannot be undone and it ends Ranger Kite's
//    planned reissue. In engineering review.
//  - a replacement wheel-hub insert for the Dune Buggy Turbo sample run: the current insert is kept,
//    so it can be undone and ends nothing. A draft.
//  - deeper panel lines on the Rock Crawler body (weld and re-cut, cannot be undone) with the
//    Rock Crawler reissue moved to the new revision, so it ends nothing. A draft.
// Idempotent: a request is found by title and tool and left as it is.
//
// A request past draft gets there through the sign-off workflow itself (`history`, run by
// server/seed/workflow.ts), so its sign-offs form a real, verifiable chain. The requests in the
// later states (brand sign-off, cleared to cut, samples, closed, declined, withdrawn) are listed in
// server/seed/workflow.ts.
import sharp from 'sharp';
import type { Transaction } from 'sequelize';
import type { RequestAction, RequestState } from '../../shared/domain/lifecycle';
import type { AttachmentKind, RequestItemInput } from '../../shared/schemas/change-requests';
import { requestItemInput } from '../../shared/schemas/change-requests';
import type { Actor } from '../lib/auth';
import { inspectImage } from '../lib/images';
import { AttachmentModel, BrandModel, ChangeRequestModel, ProductModel, UserModel } from '../models';
import { recordAudit } from '../services/audit';
import { insertRequest } from '../services/requests';
import { auditSnapshot } from '../services/request-views';
import type { seedOrganisation } from './organisation';
import type { seedRegistry } from './registry';
import { runSeedHistory, workflowDemoRequests } from './workflow';

type Org = Awaited<ReturnType<typeof seedOrganisation>>;
type Registry = Awaited<ReturnType<typeof seedRegistry>>;

const DESIGNER = 'designer@kestrelbay.example';

interface SeedItem extends Omit<RequestItemInput, 'partId' | 'id'> {
  /** Part name on the request's tool. */
  part: string;
}

interface SeedImage {
  kind: AttachmentKind;
  filename: string;
  svg: string;
  /** Index of the item the image shows, if it is about one item. */
  item?: number;
}

/** One step of a seeded request's history, taken through the workflow as that user. */
export interface SeedStep {
  by: string;
  action: RequestAction;
  /** When, counted back from now (fractions of a day allowed). */
  daysAgo: number;
  comment?: string;
  target?: 'engineering_review' | 'draft';
  /** The cut report: the trial's shots are added to the tool's counter; measured per cut item, in order. */
  cut?: { actualCostCents: number; currency: string; note: string; trialShots: number; firstArticle: { intended: string; tolerance: string; measured: string }[] };
  retestNote?: string;
}

export interface SeedEstimate {
  currency: string;
  modificationCostCents: number;
  leadDays: number;
  trialRoundsExpected?: number;
  newInsertCents?: number;
  duplicateToolCents?: number;
}

export interface SeedRequest {
  toolCode: string;
  title: string;
  reason: string;
  derivativeSku: string | null;
  /** Why the change is for no product (a request without a derivative past its draft says why). */
  noDerivativeReason?: string;
  /** The engineer's estimate and its currency, entered before the review is signed. */
  estimate?: SeedEstimate;
  targetInDays: number | null;
  status: RequestState;
  submitter: string;
  items: SeedItem[];
  movedSkus?: string[];
  images: SeedImage[];
  /** The steps from draft to `status` (none for a draft). */
  history?: SeedStep[];
}

// ---------------------------------------------------------------------------------------------
// Drawings (plain shapes on the paper background; 640 x 480)

const W = 640;
const H = 480;
const svg = (body: string) =>
  `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}"><rect width="${W}" height="${H}" fill="#F7F5F0"/>${body}</svg>`;

const headBase = `
  <rect x="292" y="330" width="56" height="70" rx="10" fill="#8795A1"/>
  <ellipse cx="320" cy="220" rx="120" ry="140" fill="#C9CED3" stroke="#17212B" stroke-width="4"/>
  <rect x="218" y="190" width="204" height="52" rx="24" fill="#17212B"/>
  <rect x="236" y="202" width="168" height="14" rx="7" fill="#5B6B78"/>`;

const headBefore = svg(headBase);
// The ridge stands proud of the brow just above the visor.
const headAfter = svg(`${headBase}
  <path d="M214 178 Q320 132 426 178 L426 190 Q320 146 214 190 Z" fill="#8795A1" stroke="#17212B" stroke-width="3"/>`);

function wheel(spokes: number) {
  const cx = 320;
  const cy = 240;
  const lines = Array.from({ length: spokes }, (_, i) => {
    const a = (2 * Math.PI * i) / spokes - Math.PI / 2;
    const x = (cx + Math.cos(a) * 118).toFixed(1);
    const y = (cy + Math.sin(a) * 118).toFixed(1);
    return `<line x1="${cx}" y1="${cy}" x2="${x}" y2="${y}" stroke="#5B6B78" stroke-width="22" stroke-linecap="round"/>`;
  }).join('');
  return svg(`
  <circle cx="${cx}" cy="${cy}" r="190" fill="#17212B"/>
  <circle cx="${cx}" cy="${cy}" r="135" fill="#C9CED3" stroke="#8795A1" stroke-width="6"/>
  ${lines}
  <circle cx="${cx}" cy="${cy}" r="34" fill="#8795A1" stroke="#17212B" stroke-width="4"/>`);
}

function crawler(lineDepth: number) {
  const panel = (x: number) => `<rect x="${x}" y="150" width="${lineDepth}" height="150" fill="#17212B"/>`;
  return svg(`
  <rect x="110" y="120" width="420" height="200" rx="26" fill="#C9CED3" stroke="#17212B" stroke-width="4"/>
  <rect x="170" y="80" width="240" height="70" rx="14" fill="#8795A1" stroke="#17212B" stroke-width="4"/>
  ${panel(250)}${panel(330)}${panel(410)}
  <circle cx="190" cy="340" r="54" fill="#17212B"/><circle cx="450" cy="340" r="54" fill="#17212B"/>`);
}

// ---------------------------------------------------------------------------------------------
// The requests

export const demoRequests: SeedRequest[] = [
  {
    toolCode: 'KB-T-0412',
    title: 'Raised visor ridge on the Kite head for Storm Kite',
    reason:
      'Storm Kite is the storm-gear version of Ranger Kite: a raised ridge across the brow, above the visor, reads as a weather shield. Re-using the Kite head tool instead of a new head tool saves most of a new tool\'s cost.',
    derivativeSku: 'SR-1002',
    targetInDays: 120,
    status: 'engineering_review',
    submitter: DESIGNER,
    // Submitted by the designer; the browser journey takes it on from engineering review to closed.
    history: [{ by: DESIGNER, action: 'submit', daysAgo: 1, comment: 'Storm Kite sculpt is final; the ridge is the only change to the head.' }],
    items: [
      {
        part: 'Head',
        effect: 'gains_plastic',
        method: 'cut',
        size: '0.8',
        unit: 'mm',
        note: 'Ridge 0.8 mm proud across the brow, blended into the visor line at both temples. Cut in both head cavities.',
        safetyFlags: ['point_or_edge'],
        region: { imageRole: 'after', shape: 'box', x: 0.32, y: 0.27, w: 0.36, h: 0.14 },
      },
    ],
    images: [
      { kind: 'before', filename: 'kite-head-before.png', svg: headBefore },
      { kind: 'after', filename: 'kite-head-after-ridge.png', svg: headAfter, item: 0 },
    ],
  },
  {
    toolCode: 'KB-T-0512',
    title: 'Six-spoke wheel hub insert for the Dune Buggy Turbo',
    reason:
      'The Turbo sample run gets a six-spoke hub. A replacement hub insert keeps the current five-spoke insert, so the Dune Buggy and Rock Crawler wheels can still be molded by swapping it back.',
    derivativeSku: 'MR-2101',
    targetInDays: 75,
    status: 'draft',
    submitter: DESIGNER,
    items: [
      {
        part: 'Wheel hub',
        effect: 'insert_swapped',
        method: 'new_insert',
        size: '38',
        unit: 'mm',
        note: 'Replacement hub insert with six spokes, same 38 mm hub diameter and axle bore. Keep the five-spoke insert labelled in the tool store.',
        safetyFlags: [],
        region: { imageRole: 'after', shape: 'circle', x: 0.2, y: 0.1, w: 0.6, h: 0.8 },
      },
    ],
    images: [
      { kind: 'before', filename: 'hub-five-spoke.png', svg: wheel(5) },
      { kind: 'after', filename: 'hub-six-spoke.png', svg: wheel(6), item: 0 },
    ],
  },
  {
    toolCode: 'KB-T-0520',
    title: 'Shallower panel lines on the Rock Crawler body',
    reason:
      'Retail samples show the deep panel lines trap paint. The reissue uses shallower lines; the reissue is moved to the new revision, so nothing planned is lost.',
    derivativeSku: null,
    targetInDays: 90,
    status: 'draft',
    submitter: DESIGNER,
    items: [
      {
        part: 'Body',
        effect: 'loses_plastic',
        method: 'weld_recut',
        size: '0.3',
        unit: 'mm',
        note: 'Weld the three raised rib lines in the cavity steel and re-cut them 0.3 mm lower, so the grooves on the part are shallower.',
        safetyFlags: [],
      },
    ],
    movedSkus: ['MR-2002'],
    images: [
      { kind: 'before', filename: 'crawler-deep-lines.png', svg: crawler(18) },
      { kind: 'after', filename: 'crawler-shallow-lines.png', svg: crawler(8) },
    ],
  },
];

const addDays = (days: number) => new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);

async function actorFor(email: string, transaction: Transaction): Promise<Actor> {
  const u = await UserModel.findOne({ where: { email }, include: [{ model: BrandModel, as: 'brands', attributes: ['id'], through: { attributes: [] } }], transaction });
  if (!u) throw new Error(`Seed user ${email} is missing`);
  return { id: u.id, email: u.email, name: u.name, role: u.role, timeZone: u.timeZone, factoryId: u.factoryId, brandIds: (u.brands ?? []).map((b) => b.id) };
}

async function productId(sku: string, transaction: Transaction) {
  const p = await ProductModel.findOne({ where: { sku }, attributes: ['id'], transaction });
  if (!p) throw new Error(`Seed product ${sku} is missing`);
  return p.id;
}

async function productIds(skus: readonly string[], transaction: Transaction) {
  const out: string[] = [];
  for (const sku of skus) out.push(await productId(sku, transaction));
  return out;
}

/** Takes the request from draft to `spec.status` through the workflow, so its sign-offs are real. */
async function afterInsert(request: ChangeRequestModel, spec: SeedRequest, transaction: Transaction) {
  await runSeedHistory(transaction, request.id, spec, (email) => actorFor(email, transaction));
}

export async function seedRequests(transaction: Transaction, org: Org, registry: Registry) {
  void org; // the users are looked up by e-mail, so edited demo users are still found
  const out = new Map<string, ChangeRequestModel>();
  for (const spec of [...demoRequests, ...workflowDemoRequests]) {
    const tool = registry.tools.get(spec.toolCode);
    if (!tool) throw new Error(`Seed tool ${spec.toolCode} is missing`);
    const existing = await ChangeRequestModel.findOne({ where: { title: spec.title, toolId: tool.id }, transaction });
    if (existing) {
      out.set(spec.title, existing);
      continue;
    }
    const actor = await actorFor(spec.submitter, transaction);
    const items = spec.items.map(({ part, ...rest }) => {
      const row = registry.parts.get(`${spec.toolCode}/${part}`);
      if (!row) throw new Error(`Seed part ${spec.toolCode}/${part} is missing`);
      return requestItemInput.parse({ ...rest, partId: row.id });
    });
    const { request, items: stored } = await insertRequest(
      actor,
      {
        toolId: tool.id,
        title: spec.title,
        reason: spec.reason,
        derivativeProductId: spec.derivativeSku ? await productId(spec.derivativeSku, transaction) : null,
        newDerivative: null,
        noDerivativeReason: spec.noDerivativeReason ?? null,
        targetDate: spec.targetInDays === null ? null : addDays(spec.targetInDays),
        items,
        movedProductIds: await productIds(spec.movedSkus ?? [], transaction),
      },
      transaction,
    );
    await recordAudit(transaction, actor, 'change_request.create', 'change_request', request.id, null, auditSnapshot(request, stored));
    for (const img of spec.images) {
      const data = await sharp(Buffer.from(img.svg)).png().toBuffer();
      const checked = await inspectImage(data, img.filename);
      await AttachmentModel.create(
        {
          requestId: request.id,
          itemId: img.item !== undefined ? (stored[img.item]?.id ?? null) : null,
          kind: img.kind,
          filename: img.filename,
          contentType: checked.contentType,
          size: checked.size,
          sha256: checked.sha256,
          width: checked.width,
          height: checked.height,
          data: checked.data,
          thumbnail: checked.thumbnail,
          uploadedBy: actor.id,
        },
        { transaction },
      );
    }
    await afterInsert(request, spec, transaction);
    out.set(spec.title, request);
  }
  return { requests: out };
}
