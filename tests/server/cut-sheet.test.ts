// The cut sheet: read back with pdf-parse (text per page), the route's roles and scope, and page 1
// rendered to PNG with poppler's pdftoppm into shots/ when it is installed.
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import { ChangeRequestModel } from '../../server/models';
import { openTestApp, request } from './helpers';
import { createDraft, insertItem, jpegImage, makeScene, ridgeItem, type Scene } from './request-fixtures';
import { actWith, pathTo, requestIn } from './workflow-fixtures';

let t: ReturnType<typeof openTestApp>;
beforeAll(() => {
  t = openTestApp();
});
afterAll(async () => {
  await t.close();
});

/** The PDF's text, whole and per page, read by pdf-parse in a child process (tests/server/pdf-text.mjs). */
const pdfOf = async (res: { body: unknown }) =>
  JSON.parse(execFileSync(process.execPath, [`${__dirname}/pdf-text.mjs`], { input: res.body as Buffer, maxBuffer: 64 * 1024 * 1024 }).toString()) as {
    total: number;
    text: string;
    pages: { num: number; text: string }[];
  };

const binary = (r: ReturnType<typeof request>['get'] extends (...a: never[]) => infer T ? T : never) => r;
const get = (id: string, user: Scene['users'][keyof Scene['users']], query = '') =>
  binary(request(t.app).get(`/api/requests/${id}/cut-sheet.pdf${query}`).set(user.auth))
    .buffer(true)
    .parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });

/** A request with many items (over several pages), a marked before and after image, walked to `state`. */
async function sheetRequest(s: Scene, state: 'brand_approval' | 'cut_authorized', itemCount = 14) {
  const items = Array.from({ length: itemCount }, (_, i) =>
    i % 2 === 0
      ? ridgeItem(s.head.id, {
          note: `Ridge ${i + 1}: raise the brow line by the size given, blend into the existing radius`,
          safetyFlags: i === 0 ? ['small_part', 'point_or_edge'] : [],
          region: { imageRole: i % 4 === 0 ? 'before' : 'after', shape: i % 4 === 0 ? 'box' : 'circle', x: 0.05 + (i % 6) * 0.12, y: 0.1 + (i % 3) * 0.2, w: 0.15, h: 0.2 },
        })
      : insertItem(s.visor.id, { note: `Visor insert ${i + 1}` }),
  );
  const d = await createDraft(t.app, s, { items });
  for (const kind of ['before', 'after']) {
    const res = await request(t.app).post(`/api/requests/${d.id}/attachments`).set(s.users.designer.auth).field('kind', kind).attach('file', await jpegImage(), `${kind}-head.jpg`);
    expect(res.status).toBe(201);
  }
  const act = actWith(t.app);
  for (const [user, action] of pathTo(s, state)) {
    const res = await act(user, d.id, action);
    if (res.status !== 201) throw new Error(`${action}: ${res.status} ${JSON.stringify(res.body)}`);
  }
  return d.id;
}

describe('cut sheet PDF', () => {
  it('when a request is cleared to cut, then the sheet holds the tool, every item, every signer, the chain head and Chinese labels, with a correct footer on every page, on A4 and Letter', async () => {
    const s = await makeScene();
    const id = await sheetRequest(s, 'cut_authorized');
    const detail = (await request(t.app).get(`/api/requests/${id}`).set(s.users.engineer.auth)).body;
    const head = detail.signOffs[detail.signOffs.length - 1].hash as string;
    const ref = `CR-${String(detail.number).padStart(4, '0')}`;
    for (const paper of ['a4', 'letter'] as const) {
      const res = await get(id, s.users.toolmaker, `?paper=${paper}`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/application\/pdf/);
      const pdf = await pdfOf(res);
      const text = pdf.text;
      expect(text).toContain(s.tool.code);
      expect(text).toContain(s.tool.name);
      expect(text).toContain('改模单');
      for (const zh of ['模具', '零件', '加工方法', '钢料处理', '签核记录', '哈希链末端']) expect(text).toContain(zh);
      for (let i = 1; i <= 14; i++) expect(text).toContain(i % 2 === 1 ? `Ridge ${i}:` : `Visor insert ${i}`);
      for (const so of detail.signOffs) expect(text).toContain(so.signer.printedName);
      // The head is long: a line break may split it, so compare with spaces and breaks taken out.
      expect(text.replace(/\s+/g, '')).toContain(head);
      expect(text).toContain('May create a small part');
      expect(text).toContain('Lifting the tool');
      expect(text).not.toContain('NOT FOR CUTTING');
      expect(pdf.total).toBeGreaterThan(2);
      pdf.pages.forEach((p, i) => {
        expect(p.text).toContain(`page ${i + 1} of ${pdf.total}`);
        expect(p.text).toContain(ref);
        expect(p.text).toContain(detail.workflow.currentContentHash.slice(0, 12));
      });
      writeShot(res.body as Buffer, `cut-sheet-${paper}`);
    }
  });

  it('when a request is not yet cleared to cut, then every page is stamped "not for cutting" in both languages', async () => {
    const s = await makeScene();
    const id = await sheetRequest(s, 'brand_approval', 10);
    const res = await get(id, s.users.lead);
    expect(res.status).toBe(200);
    const pdf = await pdfOf(res);
    expect(pdf.total).toBeGreaterThan(1);
    for (const p of pdf.pages) {
      expect(p.text).toContain('NOT FOR CUTTING');
      expect(p.text).toContain('不得用于加工');
    }
    writeShot(res.body as Buffer, 'cut-sheet-stamped-a4');
  });

  it('when the engineer gave a dimension check, then the sheet shows the shrink-compensated steel size', async () => {
    const s = await makeScene();
    const d = await createDraft(t.app, s, { items: [ridgeItem(s.head.id)] });
    // ABS at 0.5 % shrink, ASTM D955 convention: steel = part / (1 - S) (ASTM D955; 31.2 / 0.995 = 31.357 mm, half-up to 0.001).
    await ChangeRequestModel.update(
      { numbersInputs: { dimension: { oldPartMm: '30.4', newPartMm: '31.2', resinId: 'abs', shrink: '0.005', convention: 'astm_d955', formedBy: 'recess' } } },
      { where: { id: d.id } },
    );
    const pdf = await pdfOf(await get(d.id, s.users.engineer));
    expect(pdf.text).toContain('缩水补偿后的钢料尺寸');
    expect(pdf.text).toContain('31.357 mm');
  });

  it('when the cut is recorded, then the sheet carries the receipt in the record and the first-article report item by item', async () => {
    const s = await makeScene();
    const id = await requestIn(t.app, s, 'samples_review');
    const pdf = await pdfOf(await get(id, s.users.designer));
    expect(pdf.text).toContain('首件报告');
    // The fixture's report: intended 12.40 ± 0.05, measured 12.43, within tolerance.
    expect(pdf.text.replace(/\s+/g, ' ')).toMatch(/12\.40 ± 0\.05 mm .*12\.43 mm .*Pass 合格/);
    expect(pdf.text).toContain(s.users.toolmaker.user.name);
  });

  it('when callers of each role ask, then the factory of the tool, engineer, brand and admin get it; another factory, another brand and an uncleared request for the toolmaker are 404', async () => {
    const s = await makeScene();
    const cleared = await sheetRequest(s, 'cut_authorized', 1);
    for (const who of ['toolmaker', 'engineer', 'lead', 'designer', 'admin'] as const) expect((await get(cleared, s.users[who])).status).toBe(200);
    for (const who of ['otherToolmaker', 'otherLead'] as const) {
      const res = await request(t.app).get(`/api/requests/${cleared}/cut-sheet.pdf`).set(s.users[who].auth);
      expect(res.status).toBe(404);
      expect(res.body.error.code).toBe('not_found');
    }
    const early = await sheetRequest(s, 'brand_approval', 1);
    expect((await request(t.app).get(`/api/requests/${early}/cut-sheet.pdf`).set(s.users.toolmaker.auth)).status).toBe(404);
    expect((await request(t.app).get(`/api/requests/${cleared}/cut-sheet.pdf`)).status).toBe(401);
    const bad = await request(t.app).get(`/api/requests/${cleared}/cut-sheet.pdf?paper=a3`).set(s.users.engineer.auth);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fieldErrors.paper).toBeDefined();
  });
});

/** Page 1 as PNG for a look, when poppler-utils is installed (scripts/test.sh installs it). */
function writeShot(pdf: Buffer, name: string) {
  try {
    execFileSync('pdftoppm', ['-v'], { stdio: 'ignore' });
  } catch {
    return;
  }
  mkdirSync('shots', { recursive: true });
  writeFileSync(`shots/${name}.pdf`, pdf);
  execFileSync('pdftoppm', ['-png', '-r', '80', '-f', '1', '-l', '2', `shots/${name}.pdf`, `shots/${name}`]);
}
