import type { ProductStatus } from '../schemas/registry';
import { formatCents } from './money';
import { steelDirection, type SteelDirection, type SteelItem } from './steel-direction';

// Impact of a change request: which products the change ends, which are moved to the new
// revision, which are untouched, and the ways to keep the ended ones.
//
// Rule (DESIGN section 5): a product is ended when its bill of parts needs a part that an
// irreversible item changes, at the tool's CURRENT revision, it is not retired, and it is not
// explicitly moved to the new revision. A reversible item (replacement insert, old one kept) ends
// nothing: the old insert can be swapped back to make the old part.
//
// Family tools (one tool, parts for several products) are handled per part: only products that
// need a changed part are touched; a product that needs other parts of the same tool is not.

export type ImpactProductStatus = ProductStatus;

export interface ImpactTool {
  id: string;
  code: string;
  currentRevision: number;
}

export interface ImpactItem extends SteelItem {
  partId: string;
}

export interface ImpactPart {
  id: string;
  toolId: string;
  name: string;
}

export interface ImpactProduct {
  id: string;
  sku: string;
  name: string;
  status: ImpactProductStatus;
  plannedUnits: number;
}

export interface BillOfPartsLine {
  productId: string;
  partId: string;
  toolId: string;
  /** The tool revision whose geometry the product needs. */
  revision: number;
  quantityPerUnit: number;
}

export interface KeepAlternatives {
  /** Estimated cost of making the change on a replacement insert instead, in cents. */
  newInsertCents?: number | null;
  /** Estimated cost of a duplicate tool that takes the change instead, in cents. */
  duplicateToolCents?: number | null;
}

export interface ImpactInput<P extends ImpactProduct = ImpactProduct> {
  tool: ImpactTool;
  items: readonly ImpactItem[];
  parts: readonly ImpactPart[];
  products: readonly P[];
  billOfParts: readonly BillOfPartsLine[];
  /** Products explicitly moved to the new revision (they will be built from the changed part). */
  movedProductIds: readonly string[];
  alternatives?: KeepAlternatives;
}

export interface NamedPart {
  id: string;
  name: string;
}

/** A product the change ends, with the changed parts it still needs. */
export type EndedProduct<P extends ImpactProduct = ImpactProduct> = P & { affectedParts: NamedPart[] };

/** A product moved to the new revision: it stays in line and is built from the changed parts. */
export type KeptProduct<P extends ImpactProduct = ImpactProduct> = P & { affectedParts: NamedPart[] };

/**
 * retired:         it needs a changed part but is no longer made.
 * reversible_only: it needs only parts changed by swapping an insert; the old insert is kept.
 * older_revision:  it is bound to an older revision of the changed part, not the current one.
 * other_parts:     it needs only parts of this tool that the change does not touch.
 */
export type UnaffectedReason = 'retired' | 'reversible_only' | 'older_revision' | 'other_parts';

export type UnaffectedProduct<P extends ImpactProduct = ImpactProduct> = P & {
  reason: UnaffectedReason;
  reasonText: string;
};

export interface WayToKeep {
  kind: 'new_insert' | 'duplicate_tool';
  /** Null when nobody has estimated it yet. */
  costCents: number | null;
  sentence: string;
}

export interface ItemImpact {
  partId: string;
  partName: string;
  direction: SteelDirection;
}

export interface ImpactResult<P extends ImpactProduct = ImpactProduct> {
  /** True when any item changes the tool's steel for good. */
  irreversible: boolean;
  /** True when any item takes steel out (the sign-off wording says "removing steel"). */
  removesSteel: boolean;
  items: ItemImpact[];
  endedProducts: EndedProduct<P>[];
  keptProducts: KeptProduct<P>[];
  unaffectedProducts: UnaffectedProduct<P>[];
  /** Sum of planned units of the ended products. */
  endedPlannedUnits: number;
  /** Empty when nothing is ended. */
  waysToKeep: WayToKeep[];
  summary: string;
}

/** Thrown when the inputs do not describe one tool consistently (a caller's data error). */
export class ImpactInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ImpactInputError';
  }
}

/** "A", "A and B", "A, B and C". */
export function listInWords(names: readonly string[]): string {
  if (names.length <= 1) return names[0] ?? '';
  return `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}`;
}

const productWord = (n: number) => (n === 1 ? 'product' : 'products');
const productTitle = (p: ImpactProduct) => `${p.sku} ${p.name}`;

function checkCents(label: string, v: number | null | undefined): number | null {
  if (v === undefined || v === null) return null;
  if (!Number.isSafeInteger(v) || v < 0) throw new ImpactInputError(`${label} must be whole cents, zero or more (got ${v})`);
  return v;
}

function waysToKeep(tool: ImpactTool, ended: readonly ImpactProduct[], alt: KeepAlternatives | undefined): WayToKeep[] {
  if (ended.length === 0) return [];
  const names = listInWords(ended.map(productTitle));
  const insert = checkCents('newInsertCents', alt?.newInsertCents);
  const duplicate = checkCents('duplicateToolCents', alt?.duplicateToolCents);
  const price = (c: number | null) => (c === null ? 'no estimate yet; ask the tooling engineer' : `estimated ${formatCents(c)}`);
  return [
    {
      kind: 'new_insert',
      costCents: insert,
      sentence: `Make the change on a replacement insert and keep the current one, so ${names} can still be made from tool ${tool.code}: ${price(insert)}.`,
    },
    {
      kind: 'duplicate_tool',
      costCents: duplicate,
      sentence: `Build a duplicate of tool ${tool.code} and make the change on the duplicate, so the original keeps making ${names}: ${price(duplicate)}.`,
    },
  ];
}

/** The products a change request ends, keeps and leaves alone, with the ways to keep the ended ones. */
export function computeImpact<P extends ImpactProduct>(input: ImpactInput<P>): ImpactResult<P> {
  const { tool } = input;
  const partsById = new Map(input.parts.map((p) => [p.id, p]));

  const items: ItemImpact[] = input.items.map((item) => {
    const part = partsById.get(item.partId);
    if (!part) throw new ImpactInputError(`Part ${item.partId} of a cut item is not in the parts list`);
    if (part.toolId !== tool.id) throw new ImpactInputError(`Part "${part.name}" is not molded by tool ${tool.code}`);
    return { partId: part.id, partName: part.name, direction: steelDirection(item) };
  });

  const irreversiblePartIds = new Set(items.filter((i) => i.direction.irreversible).map((i) => i.partId));
  const swappedPartIds = new Set(items.filter((i) => !i.direction.irreversible && !irreversiblePartIds.has(i.partId)).map((i) => i.partId));
  const changedPartIds = new Set([...irreversiblePartIds, ...swappedPartIds]);
  const moved = new Set(input.movedProductIds);
  const named = (ids: Iterable<string>): NamedPart[] =>
    [...new Set(ids)].map((id) => ({ id, name: partsById.get(id)?.name ?? id }));

  const ended: EndedProduct<P>[] = [];
  const kept: KeptProduct<P>[] = [];
  const unaffected: UnaffectedProduct<P>[] = [];

  for (const product of input.products) {
    const onTool = input.billOfParts.filter((l) => l.productId === product.id && l.toolId === tool.id);
    if (onTool.length === 0) continue; // not made from this tool at all
    const current = onTool.filter((l) => l.revision === tool.currentRevision);
    const endingIds = current.filter((l) => irreversiblePartIds.has(l.partId)).map((l) => l.partId);
    const changedIds = current.filter((l) => changedPartIds.has(l.partId)).map((l) => l.partId);
    const leave = (reason: UnaffectedReason, reasonText: string) => unaffected.push({ ...product, reason, reasonText });

    if (changedIds.length > 0 && product.status === 'retired') {
      leave('retired', `Retired: it needs ${listInWords(named(changedIds).map((p) => p.name))}, but it is no longer made.`);
    } else if (changedIds.length > 0 && moved.has(product.id)) {
      kept.push({ ...product, affectedParts: named(changedIds) });
    } else if (endingIds.length > 0) {
      ended.push({ ...product, affectedParts: named(endingIds) });
    } else if (changedIds.length > 0) {
      leave(
        'reversible_only',
        `Not ended: it needs ${listInWords(named(changedIds).map((p) => p.name))}, changed only by a replacement insert; the current insert is kept and can be swapped back.`,
      );
    } else if (onTool.some((l) => changedPartIds.has(l.partId))) {
      leave('older_revision', `Not ended: it is bound to an older revision of tool ${tool.code}, not revision ${tool.currentRevision}.`);
    } else {
      leave('other_parts', `Not ended: it needs only parts of tool ${tool.code} that this change does not touch.`);
    }
  }

  const irreversible = items.some((i) => i.direction.irreversible);
  const removesSteel = items.some((i) => i.direction.steelAction === 'remove');
  return {
    irreversible,
    removesSteel,
    items,
    endedProducts: ended,
    keptProducts: kept,
    unaffectedProducts: unaffected,
    endedPlannedUnits: ended.reduce((sum, p) => sum + p.plannedUnits, 0),
    waysToKeep: waysToKeep(tool, ended, input.alternatives),
    summary: summarise(tool, items.length, irreversible, ended, kept),
  };
}

function summarise(tool: ImpactTool, itemCount: number, irreversible: boolean, ended: readonly ImpactProduct[], kept: readonly ImpactProduct[]): string {
  if (itemCount === 0) return `No cut items on tool ${tool.code} yet, so the change ends no product.`;
  const keptText = kept.length > 0 ? ` ${listInWords(kept.map(productTitle))} ${kept.length === 1 ? 'moves' : 'move'} to the new revision.` : '';
  if (!irreversible) {
    return `This change to tool ${tool.code} can be undone: the current insert is kept and can be swapped back, so it ends no product.${keptText}`;
  }
  if (ended.length === 0) {
    return `This change to tool ${tool.code} cannot be undone, but it ends no product: nothing in line or planned still needs the changed parts at revision ${tool.currentRevision}.${keptText}`;
  }
  return `This change to tool ${tool.code} cannot be undone: it ends ${ended.length} ${productWord(ended.length)} that still ${ended.length === 1 ? 'needs' : 'need'} the changed parts at revision ${tool.currentRevision}: ${listInWords(ended.map(productTitle))}.${keptText}`;
}
