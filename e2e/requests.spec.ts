import { mkdirSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type { Page, Route } from '@playwright/test';
import { expect, signInAs, test } from './fixtures';

// Change requests in the browser: the designer writes one from a phone with before and after
// images and a cut that cannot be undone; the form warns as they type and names the product it
// ends; the detail shows the same. Each run makes its own request, so the spec runs against any
// seeded database. The pictures are drawn here (sharp renders an SVG to PNG).

const DESIGNER = 'designer@kestrelbay.example';
const ENGINEER = 'engineer@kestrelbay.example';
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

const dir = path.join(os.tmpdir(), 'toolgate-e2e-requests');
const head = (ridge: boolean) => `<svg xmlns="http://www.w3.org/2000/svg" width="480" height="360" viewBox="0 0 480 360">
  <rect width="480" height="360" fill="#F7F5F0"/>
  <ellipse cx="240" cy="170" rx="96" ry="112" fill="#C9CED3" stroke="#17212B" stroke-width="4"/>
  <rect x="160" y="146" width="160" height="40" rx="18" fill="#17212B"/>
  ${ridge ? '<path d="M156 136 Q240 98 324 136 L324 146 Q240 110 156 146 Z" fill="#8795A1" stroke="#17212B" stroke-width="3"/>' : ''}
</svg>`;

async function pictures() {
  mkdirSync(dir, { recursive: true });
  const before = path.join(dir, 'kite-head-before.png');
  const after = path.join(dir, 'kite-head-after.png');
  const notImage = path.join(dir, 'notes-renamed.png');
  await sharp(Buffer.from(head(false))).png().toFile(before);
  await sharp(Buffer.from(head(true))).png().toFile(after);
  writeFileSync(notImage, 'This is a text file with a picture name.\n');
  return { before, after, notImage };
}

/** Opens the picker of an image group and hands it the files (expo-image-picker opens a file chooser on the web). */
async function pickFiles(page: Page, buttonTestId: string, files: string[]) {
  const chooser = page.waitForEvent('filechooser');
  await page.getByTestId(buttonTestId).click();
  await (await chooser).setFiles(files);
}

/**
 * The screens scroll inside the app (not the document), so a "full page" shot would stop at the
 * viewport: grow the viewport to the content's height for the shot, then put it back.
 */
async function fullShot(page: Page, file: string) {
  const size = page.viewportSize()!;
  const height = await page.evaluate(() => Math.max(...Array.from(document.querySelectorAll('div')).map((d) => (d.scrollHeight > d.clientHeight + 4 ? d.scrollHeight : 0)), 0));
  if (height > size.height) await page.setViewportSize({ width: size.width, height: Math.min(height + 80, 12_000) });
  await page.screenshot({ path: file });
  await page.setViewportSize(size);
}

test.describe('change requests', () => {
  test('when a designer writes a request with two images and a cut that cannot be undone, then the form and the detail warn and name the ended product', async ({ page }, info) => {
    const shots = (name: string) => `shots/${info.project.name}-requests-${name}.png`;
    const files = await pictures();
    const id = stamp();
    await signInAs(page, DESIGNER);
    await page.getByTestId('tab-requests').click();
    await expect(page).toHaveURL(/\/requests$/);
    // Newest change first; a change that cannot be undone says so in words on its row.
    const rows = page.getByTestId('request-rows').getByRole('link', { name: /^CR-\d{4} / });
    await expect(rows.first()).toBeVisible();
    await expect(page.getByTestId(/^request-row-CR-\d{4}-irreversible$/).first()).toHaveText('Cannot be undone');
    await page.screenshot({ path: shots('list') });
    // Keyset pages: "Load more" appends the next page when there is one.
    if (await page.getByTestId('request-load-more').isVisible()) {
      const before = await rows.count();
      await page.getByTestId('request-load-more').click();
      await expect.poll(() => rows.count()).toBeGreaterThan(before);
    }

    await page.getByTestId('request-new').click();
    await expect(page).toHaveURL(/\/requests\/new$/);
    const form = page.getByTestId('request-form');

    // The tool, found by the figure's name.
    await form.getByTestId('request-tool-search').fill('Ranger Kite');
    await form.getByTestId('request-tool-option-KB-T-0412').click();
    await expect(form.getByTestId('request-tool-chosen')).toContainText('KB-T-0412');

    await form.getByTestId('request-title').fill(`Storm visor ridge ${id}`);
    await form.getByTestId('request-reason').fill('A raised ridge above the visor for the storm-gear figure.');
    await form.getByTestId('request-derivative-mode-existing').click();
    await form.getByTestId('request-derivative-search').fill('Storm');
    await form.getByTestId('request-derivative-option-SR-1002').click();
    await form.getByTestId('request-target-date').fill('2027-04-30');

    // Before and after images: held until the draft exists, each with its preview.
    await pickFiles(page, 'request-form-images-before-add', [files.before]);
    await pickFiles(page, 'request-form-images-after-add', [files.after]);
    await expect(form.getByTestId('request-form-images-before-queued-kite-head-before.png-status')).toHaveText(/Waits for the first save/);
    await expect(form.getByTestId('request-form-images-after-queued-kite-head-after.png')).toBeVisible();

    // The cut item: the form refuses a method that contradicts the effect as soon as both are picked.
    const item = form.getByTestId('item-1');
    await item.getByRole('radio', { name: /^Head/ }).click();
    await item.getByTestId('item-1-effect-gains_plastic').click();
    await item.getByTestId('item-1-method-weld_recut').click();
    await expect(item.getByTestId('item-1-method-error')).toContainText('Welding adds steel');
    await item.getByTestId('item-1-method-cut').click();
    await expect(item.getByTestId('item-1-method-error')).toHaveCount(0);
    await expect(item.getByTestId('item-1-steel')).toContainText('Cannot be undone');
    await item.getByTestId('item-1-size').fill('0.8');
    await item.getByTestId('item-1-note').fill('Ridge across the brow, blended into the visor at both temples.');
    await item.getByTestId('item-1-safety-point_or_edge').click();
    await item.getByTestId('item-1-region-add').click();
    await item.getByTestId('item-1-region-role-after').click();
    // Drawing on the picture sets the mark (as fractions shown in percent)...
    await item.getByTestId('item-1-region-surface').scrollIntoViewIfNeeded();
    const surface = (await item.getByTestId('item-1-region-surface').boundingBox())!;
    await page.mouse.move(surface.x + surface.width * 0.1, surface.y + surface.height * 0.2);
    await page.mouse.down();
    await page.mouse.move(surface.x + surface.width * 0.4, surface.y + surface.height * 0.5, { steps: 3 });
    await page.mouse.move(surface.x + surface.width * 0.6, surface.y + surface.height * 0.6, { steps: 3 });
    await page.mouse.up();
    expect(Math.abs(Number(await item.getByTestId('item-1-region-x').inputValue()) - 10)).toBeLessThan(2);
    expect(Math.abs(Number(await item.getByTestId('item-1-region-w').inputValue()) - 50)).toBeLessThan(2);
    // ...and the numbers fine-tune it.
    await item.getByTestId('item-1-region-x').fill('30');
    await item.getByTestId('item-1-region-y').fill('25');
    await item.getByTestId('item-1-region-w').fill('40');
    await item.getByTestId('item-1-region-h').fill('15');

    // The warning, as typed: in words, naming the product the cut ends.
    const banner = info.project.name === 'wide' ? form.getByTestId('form-impact-banner') : form.getByTestId('request-form-banner');
    await expect(banner).toContainText('This change cannot be undone');
    await expect(banner).toContainText('SR-1001');
    await expect(banner).toContainText('Ranger Kite');
    await expect(form.getByTestId('form-impact-ended-SR-1001')).toBeVisible();
    await expect(form.getByTestId('form-safety-point_or_edge')).toBeVisible();
    await fullShot(page, shots('form'));

    await form.getByTestId('request-save').click();
    await expect(page).toHaveURL(/\/requests\/[0-9a-f-]{36}$/);
    const detail = page.getByTestId('request-detail');
    await expect(detail.getByTestId('request-banner')).toContainText('This change cannot be undone');
    await expect(detail.getByTestId('request-banner')).toContainText('Ranger Kite');
    await expect(detail.getByTestId('request-detail-status')).toHaveText('Being written');
    // Both images arrive (sent one after the other) and show side by side, the mark on the after image.
    await expect(detail.getByTestId('image-compare-before')).toBeVisible({ timeout: 20_000 });
    await expect(detail.getByTestId('image-compare-after')).toBeVisible({ timeout: 20_000 });
    await expect(detail.getByTestId('image-compare-after-mark-1')).toBeVisible();
    await expect(detail.getByTestId('request-detail-images-before-file-kite-head-before.png')).toContainText('Sent');
    await expect(detail.getByTestId('request-detail-images-after-file-kite-head-after.png')).toContainText('Sent');
    await expect(detail.getByTestId('request-items-1-steel')).toContainText('Cannot be undone');
    await expect(detail.getByTestId('request-impact-ended-SR-1001')).toBeVisible();
    await expect(detail.getByTestId('request-safety-closing')).toContainText('accredited');
    await fullShot(page, shots('detail'));
  });

  test('when an engineer opens the seeded head re-cut, then the warning, both images, the overlay slider and the cut-item editing are there', async ({ page }, info) => {
    const shots = (name: string) => `shots/${info.project.name}-requests-${name}.png`;
    await signInAs(page, ENGINEER);
    await page.getByTestId('tab-requests').click();
    // Filters: the seeded insert swap can be undone, so "Cannot be undone" hides it.
    await page.getByTestId('request-search').fill('CR-0002');
    await expect(page.getByTestId('request-row-CR-0002')).toBeVisible();
    await expect(page.getByTestId('request-row-CR-0002-irreversible')).toHaveCount(0);
    await page.getByTestId('request-toggles-irreversible').click();
    await expect(page.getByTestId('requests-empty')).toContainText('No request matches');
    await page.getByTestId('request-toggles-irreversible').click();
    await page.getByTestId('request-search').fill('CR-0001');
    await page.getByTestId('request-row-CR-0001').click();
    const detail = page.getByTestId('request-detail');
    // Anyone opening it sees, without reading the items, that it cannot be undone and what it ends.
    await expect(detail.getByTestId('request-banner')).toContainText('This change cannot be undone');
    await expect(detail.getByTestId('request-banner-product-SR-1001')).toContainText('Ranger Kite');
    await expect(detail.getByTestId('request-detail-status')).toHaveText('With engineering');
    await expect(detail.getByTestId('image-compare-before')).toBeVisible();
    await expect(detail.getByTestId('image-compare-after-mark-1')).toBeVisible();
    await expect(detail.getByTestId('request-items-1-why')).toContainText('Steel cannot be put back');
    await expect(detail.getByTestId('request-safety-ref-sharp_point_force')).toContainText('16 CFR 1500.48');
    await fullShot(page, shots('detail-engineer'));

    // Overlay: the after image is revealed over the before one, by steps and by dragging.
    await detail.getByTestId('image-compare-mode-overlay').click();
    const value = detail.getByTestId('image-compare-overlay-value');
    await expect(value).toContainText('50 %');
    await detail.getByTestId('image-compare-overlay-more').click();
    await expect(value).toContainText('60 %');
    const box = (await detail.getByTestId('image-compare-overlay').boundingBox())!;
    await page.mouse.move(box.x + box.width * 0.5, box.y + box.height / 2);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2, { steps: 4 });
    await page.mouse.move(box.x + box.width * 0.25, box.y + box.height / 2, { steps: 2 });
    await page.mouse.up();
    await expect(value).toContainText('25 %');
    await detail.getByTestId('image-compare-overlay').scrollIntoViewIfNeeded();
    await page.screenshot({ path: shots('overlay') });

    // During engineering review the engineer may change the cut items, not the designer's fields.
    await expect(detail.getByTestId('request-edit')).toHaveText(/Edit cut items/);
    await detail.getByTestId('request-edit').click();
    const form = page.getByTestId('request-form');
    await expect(form.getByText('Engineering review', { exact: true })).toBeVisible();
    await expect(form.getByTestId('request-title')).not.toBeEditable();
    await expect(form.getByTestId('item-1-size')).toBeEditable();
    await expect(form.getByTestId('item-1-size')).toHaveValue('0.8');
    await fullShot(page, shots('form-engineer'));
  });

  test('when the network drops while a draft is edited, then the text stays on the device, survives a reload and is sent when the network is back', async ({ page }) => {
    const id = stamp();
    await signInAs(page, DESIGNER);
    const r = await newDraftByApi(page, `Offline test ${id}`);
    // Saves fail as if the connection were gone.
    const offline = (route: Route) => (route.request().method() === 'PATCH' ? route.abort('internetdisconnected') : route.continue());
    await page.route('**/api/requests/*', offline);
    await page.goto(`/requests/${r.id}/edit`);
    const form = page.getByTestId('request-form');
    await form.getByTestId('request-title').fill(`Offline test ${id} with the edit`);
    await expect(form.getByTestId('request-save-state-text').first()).toContainText('Saved on this device, not yet sent', { timeout: 15_000 });

    await page.reload();
    await expect(page.getByTestId('request-restored')).toBeVisible();
    await expect(page.getByTestId('request-title')).toHaveValue(`Offline test ${id} with the edit`);

    await page.unroute('**/api/requests/*', offline);
    await page.getByTestId('request-save').click();
    await expect(page.getByTestId('request-save-state-text').first()).toContainText('Saved at');
    const saved = await (await page.request.get(`/api/requests/${r.id}`)).json();
    expect(saved.title).toBe(`Offline test ${id} with the edit`);
  });

  test('when someone else saves first, then nothing is overwritten and the designer can load their version with the own text kept in sight', async ({ page }, info) => {
    const id = stamp();
    await signInAs(page, DESIGNER);
    const r = await newDraftByApi(page, `Conflict test ${id}`);
    await page.goto(`/requests/${r.id}/edit`);
    const form = page.getByTestId('request-form');
    await expect(form.getByTestId('request-title')).toHaveValue(`Conflict test ${id}`);
    // Another tab saves a new title.
    const other = await page.request.patch(`/api/requests/${r.id}`, { data: { version: r.version, title: `Their title ${id}` } });
    expect(other.status()).toBe(200);

    await form.getByTestId('request-reason').fill('My reason, typed in this tab.');
    await expect(form.getByTestId('request-conflict')).toBeVisible({ timeout: 15_000 });
    await expect(form.getByTestId('request-reason')).toHaveValue('My reason, typed in this tab.');
    await page.screenshot({ path: `shots/${info.project.name}-requests-conflict.png` });

    await form.getByTestId('request-conflict-theirs').click();
    await expect(form.getByTestId('request-title')).toHaveValue(`Their title ${id}`);
    await expect(form.getByTestId('request-unsent-copy')).toContainText('My reason, typed in this tab.');
  });

  test('when several images are picked at once and one is not a picture, then the good one is sent and the other is refused in words', async ({ page }) => {
    const files = await pictures();
    await signInAs(page, DESIGNER);
    const r = await newDraftByApi(page, `Upload test ${stamp()}`);
    await page.goto(`/requests/${r.id}/edit`);
    await pickFiles(page, 'request-form-images-before-add', [files.before, files.notImage]);
    const images = page.getByTestId('request-form-images');
    await expect(images.getByTestId('request-form-images-before-file-kite-head-before.png')).toContainText('Sent');
    const refused = images.getByTestId('request-form-images-before-queued-notes-renamed.png-error');
    await expect(refused).toBeVisible();
    await expect(refused).not.toHaveText('');
    await expect(images.getByTestId('request-form-images-before-queued-notes-renamed.png-retry')).toBeVisible();
    const stored = await (await page.request.get(`/api/requests/${r.id}`)).json();
    expect(stored.attachments.map((a: { filename: string }) => a.filename)).toEqual(['kite-head-before.png']);

    // A draft's image can be removed again, after a second press.
    await images.getByTestId('request-form-images-before-file-kite-head-before.png-remove').click();
    await images.getByTestId('request-form-images-before-file-kite-head-before.png-remove-confirm').click();
    await expect(images.getByTestId('request-form-images-before-file-kite-head-before.png')).toHaveCount(0);
    const after = await (await page.request.get(`/api/requests/${r.id}`)).json();
    expect(after.attachments).toEqual([]);
  });
});

/** A fresh draft on the Ranger Kite head tool, made through the API (the browser's session). */
async function newDraftByApi(page: Page, title: string): Promise<{ id: string; version: number }> {
  const tools = await (await page.request.get('/api/tools?q=KB-T-0412')).json();
  const tool = tools.data.find((t: { code: string }) => t.code === 'KB-T-0412');
  const res = await page.request.post('/api/requests', { data: { toolId: tool.id, title } });
  expect(res.status()).toBe(201);
  return res.json();
}

