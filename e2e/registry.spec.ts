import { expect, signInAs, test } from './fixtures';

// Runs against the seeded demo registry (server/seed/registry.ts). Rows this spec writes get
// unique codes, so it can run again on the same database.
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`.toUpperCase();

test.describe('tool registry', () => {
  test('when an engineer on a phone searches a part name, then the tool opens with its life gauge and products', async ({ page }, info) => {
    test.skip(info.project.name !== 'phone', 'phone journey');
    await signInAs(page, 'engineer@kestrelbay.example');
    await page.getByTestId('tab-tools').click();
    const list = page.getByTestId('tools-screen');
    await expect(list.getByTestId('tool-row-KB-T-0412')).toBeVisible();
    await page.screenshot({ path: `shots/${info.project.name}-tools-list.png` });

    // "Visor" is a part name only (of the Ranger Kite head tool), not a tool name.
    await list.getByTestId('tools-search').fill('visor');
    await expect(list.getByTestId('tools-count')).toHaveText('1 tool');
    const row = list.getByTestId('tool-row-KB-T-0412');
    await expect(row).toContainText('Ranger Kite head');
    await expect(row).toContainText('Harbourline Plastics');
    await expect(row.getByTestId('tool-row-KB-T-0412-life-band')).toHaveText('Good life left');
    await page.screenshot({ path: `shots/${info.project.name}-tools-search.png` });
    await row.click();

    const detail = page.getByTestId('tool-detail');
    await expect(detail.getByTestId('tool-code')).toHaveText('KB-T-0412');
    // 212,400 of 500,000 rated shots (class 103 figure) = 42.5 % used.
    await expect(detail.getByTestId('tool-life-gauge-percent')).toHaveText('42.5 %');
    await expect(detail.getByTestId('tool-life-gauge-band')).toHaveText('Good life left');
    await expect(detail.getByTestId('tool-life-remaining')).toHaveText('287,600');
    await expect(detail.getByTestId('tool-life-source')).toContainText('Class 103');
    const product = detail.getByTestId('tool-revision-product-SR-1001');
    await expect(product).toContainText('Ranger Kite');
    await expect(product).toContainText('Needs Head, Visor');
    await expect(detail.getByTestId('tool-revision-product-SR-1001-makeable')).toHaveText('Can be made');
    await expect(detail.getByTestId('tool-handling-caution')).toContainText('qualified riggers');
    // The demo visor-ridge request is open on this tool (in engineering review).
    await expect(detail.getByTestId('tool-open-changes')).toContainText('Raised visor ridge on the Kite head for Storm Kite');
    await page.screenshot({ path: `shots/${info.project.name}-tool-detail.png`, fullPage: true });

    // From the tool to the product it makes.
    await product.click();
    const productDetail = page.getByTestId('product-detail');
    await expect(productDetail.getByTestId('product-sku')).toHaveText('SR-1001');
    await expect(productDetail.getByTestId('product-makeability-answer')).toHaveText('Yes, it can be made');
    await page.screenshot({ path: `shots/${info.project.name}-product-detail.png`, fullPage: true });
  });

  test('when an engineer on a wide screen opens the tools, then a table shows them and a filter narrows it', async ({ page }, info) => {
    test.skip(info.project.name !== 'wide', 'wide layout');
    await signInAs(page, 'engineer@kestrelbay.example');
    await page.getByTestId('tab-tools').click();
    const list = page.getByTestId('tools-screen');
    const table = list.getByTestId('tool-table');
    await expect(table.getByRole('columnheader')).toHaveText(['Code', 'Tool', 'Factory', 'Status', 'Life used', 'Keep or scrap']);
    await expect(table.getByTestId('tool-row-KB-T-0412')).toBeVisible();
    await expect(table.getByTestId('tool-row-KB-T-0511')).toBeVisible();
    await page.screenshot({ path: `shots/${info.project.name}-tools-list.png`, fullPage: true });

    // Life filter: only tools past 80 % of their rated life, each saying so in words.
    await list.getByTestId('tools-filter-life').click();
    await list.getByTestId('tools-filter-life-worn').click();
    await expect(list.getByTestId('tools-filter-life')).toHaveText(/Life: Over 80 % used/);
    const bands = table.locator('[data-testid$="-life-band"]');
    await expect(bands.first()).toBeVisible();
    for (const text of await bands.allTextContents()) expect(text).toBe('Over 80 % used');
    await page.screenshot({ path: `shots/${info.project.name}-tools-worn.png` });

    // The retention marker and filter: the Heron head falls due within 90 days (seeded 45 days ahead).
    await list.getByTestId('tools-filter-clear').click();
    await list.getByTestId('tools-filter-retention').click();
    await expect(table.getByTestId('tool-row-KB-T-0388')).toContainText(/Due in \d+ days/);
    await expect(table.getByTestId('tool-row-KB-T-0412')).toHaveCount(0);

    // Export the filtered list.
    const download = page.waitForEvent('download');
    await list.getByTestId('tools-export').click();
    expect((await download).suggestedFilename()).toMatch(/^tools-\d{4}-\d{2}-\d{2}\.csv$/);
  });

  test('when an engineer on a wide screen opens a product, then it says whether it can be made and from which tools', async ({ page }, info) => {
    test.skip(info.project.name !== 'wide', 'wide layout');
    await signInAs(page, 'engineer@kestrelbay.example');
    await page.getByTestId('tab-products').click();
    const list = page.getByTestId('products-screen');
    await expect(list.getByTestId('product-table')).toBeVisible();
    await expect(list.getByTestId('product-table-SR-1001-makeable')).toHaveText('Can be made');
    // The Lark figure needs a head from a scrapped tool.
    await expect(list.getByTestId('product-table-SR-0801-makeable')).toHaveText('Cannot be made');
    await page.screenshot({ path: `shots/${info.project.name}-products-list.png`, fullPage: true });

    await list.getByTestId('product-row-SR-0801').click();
    let detail = page.getByTestId('product-detail');
    await expect(detail.getByTestId('product-makeability-answer')).toHaveText('No, not as things stand');
    await expect(detail.getByTestId('product-blockers')).toContainText('Tool KB-T-0301 is disposed');
    await page.screenshot({ path: `shots/${info.project.name}-product-blocked.png`, fullPage: true });

    await page.getByTestId('tab-products').click();
    await list.getByTestId('products-search').fill('SR-1001');
    await list.getByTestId('product-row-SR-1001').click();
    detail = page.getByTestId('product-detail').filter({ hasText: 'SR-1001' });
    await expect(detail.getByTestId('product-retail')).toHaveText('$12.99');
    await expect(detail.getByTestId('product-units')).toHaveText('40,000');
    await expect(detail.getByTestId('product-tool-KB-T-0412')).toContainText('Needs rev 1; the tool is at rev 1');
    await page.screenshot({ path: `shots/${info.project.name}-product-detail.png`, fullPage: true });

    // Edit: the form refuses a retail price below wholesale before sending; then a change is saved and put back.
    await detail.getByTestId('product-edit').click();
    const edit = page.getByTestId('product-edit-screen');
    await edit.getByTestId('product-form-retail').fill('5.99');
    await edit.getByTestId('product-edit-save').click();
    await expect(edit.getByTestId('product-form-retail-error')).toHaveText('Retail price is below the wholesale price');
    await edit.getByTestId('product-form-retail').fill('12.99');
    await edit.getByTestId('product-form-plannedUnits').fill('42000');
    await page.screenshot({ path: `shots/${info.project.name}-product-edit.png`, fullPage: true });
    await edit.getByTestId('product-edit-save').click();
    await expect(detail.getByTestId('product-units')).toHaveText('42,000');
    await detail.getByTestId('product-edit').click();
    await page.getByTestId('product-edit-screen').getByTestId('product-form-plannedUnits').fill('40000');
    await page.getByTestId('product-edit-screen').getByTestId('product-edit-save').click();
    await expect(detail.getByTestId('product-units')).toHaveText('40,000');

    await detail.getByTestId('product-tool-KB-T-0412').click();
    await expect(page.getByTestId('tool-detail').getByTestId('tool-code')).toHaveText('KB-T-0412');
    await page.screenshot({ path: `shots/${info.project.name}-tool-detail.png`, fullPage: true });
  });

  test('when a toolmaker opens the tools, then only Harbourline Plastics tools are listed and others are not found', async ({ page, playwright, baseURL }, info) => {
    // Another factory's tool id, read as the engineer.
    const api = await playwright.request.newContext({ baseURL });
    await api.post('/api/auth/sign-in', { data: { email: 'engineer@kestrelbay.example', password: 'toolgate-demo' } });
    const pearl = (await (await api.get('/api/tools?q=KB-T-0420')).json()).data[0] as { id: string; factory: { name: string } };
    expect(pearl.factory.name).toBe('Pearl Delta Moldworks');
    await api.dispose();

    await signInAs(page, 'toolmaker@harbourline.example');
    await page.getByTestId('tab-tools').click();
    const list = page.getByTestId('tools-screen');
    await expect(list.getByTestId('tools-factory-scope')).toHaveText('You see the tools at Harbourline Plastics only.');
    await expect(list.getByTestId('tool-row-KB-T-0412')).toBeVisible();
    const rows = list.getByRole('link', { name: /^Open tool / });
    const count = await rows.count();
    expect(count).toBeGreaterThan(3);
    for (let i = 0; i < count; i += 1) await expect(rows.nth(i)).toContainText('Harbourline Plastics');
    await expect(list.getByTestId('tool-row-KB-T-0420')).toHaveCount(0);
    // No factory filter and no writing for toolmakers.
    await expect(list.getByTestId('tools-filter-factory')).toHaveCount(0);
    await expect(list.getByTestId('tools-import')).toHaveCount(0);
    await page.screenshot({ path: `shots/${info.project.name}-tools-toolmaker.png`, fullPage: true });

    await page.goto(`/tools/${pearl.id}`);
    await expect(page.getByTestId('tool-detail').getByTestId('error-state')).toContainText('Not found');
  });

  test('when an engineer imports a tool from CSV, edits it and scraps it, then each step is checked and the record ends read-only', async ({ page }, info) => {
    const code = `KB-E2E-${stamp()}`;
    await signInAs(page, 'engineer@kestrelbay.example');
    await page.getByTestId('tab-tools').click();
    await page.getByTestId('tools-screen').getByTestId('tools-import').click();
    const screen = page.getByTestId('tool-import-screen');
    await expect(screen.getByTestId('import-columns')).toContainText('code*');

    // Every column of the tools template, in its order (empty cells: not given).
    const header = 'code,name,brand_code,factory,construction,mold_class,rated_shots,rated_shots_source,cavity_count,weight_kg,build_cost,currency,build_date,shot_count,last_run_date,status,storage_location';
    const good = `${code},Finch head (test),SR,Harbourline Plastics,hardened_steel,103,,,2,310,12500.00,USD,2025-11-03,1200,2026-01-15,active,Harbourline bay D`;
    const bad = `${header}\n${good}\nKB-E2E-BAD,Bad row,SR,Harbourline Plastics,hardened_steel,109,,,2,,,,,,,,\n`;
    await screen.getByTestId('import-csv').fill(bad);
    await screen.getByTestId('import-check').click();
    await expect(screen.getByTestId('import-has-errors')).toBeVisible();
    await expect(screen.getByTestId('import-row-3')).toContainText('mold_class');
    await expect(screen.getByTestId('import-apply')).toBeDisabled();
    await page.screenshot({ path: `shots/${info.project.name}-import-errors.png`, fullPage: true });

    // Drop the bad row: the earlier check no longer counts until the rows are checked again.
    await screen.getByTestId('import-csv').fill(bad.split('\n').slice(0, 2).join('\n'));
    await expect(screen.getByTestId('import-recheck')).toBeVisible();
    await screen.getByTestId('import-check').click();
    await expect(screen.getByTestId('import-clean')).toBeVisible();
    await expect(screen.getByTestId('import-count-created')).toHaveText('1 to create');
    await screen.getByTestId('import-apply').click();
    await expect(screen.getByTestId('import-applied')).toContainText('1 row created');
    await page.screenshot({ path: `shots/${info.project.name}-import-applied.png`, fullPage: true });

    // Find it, open it, edit it.
    await page.goto('/tools');
    const list = page.getByTestId('tools-screen');
    await list.getByTestId('tools-search').fill(code);
    await list.getByTestId(`tool-row-${code}`).click();
    let detail = page.getByTestId('tool-detail');
    await expect(detail.getByTestId('tool-code')).toHaveText(code);
    await detail.getByTestId('tool-edit').click();
    const edit = page.getByTestId('tool-edit-screen');
    await edit.getByTestId('tool-form-storageLocation').fill('Harbourline bay D, rack 9');
    await edit.getByTestId('tool-form-shotCount').fill('-3');
    await edit.getByTestId('tool-edit-save').click();
    await expect(edit.getByTestId('tool-form-shotCount-error')).toHaveText('Use a whole number (digits only)');
    await edit.getByTestId('tool-form-shotCount').fill('1500');
    await page.screenshot({ path: `shots/${info.project.name}-tool-edit.png`, fullPage: true });

    // Someone else saves first: this save is refused and the form offers a reload.
    const id = page.url().split('/').at(-2)!;
    const current = await (await page.request.get(`/api/tools/${id}`)).json();
    expect((await page.request.patch(`/api/tools/${id}`, { data: { version: current.version, name: 'Finch head (renamed)' } })).ok()).toBe(true);
    await edit.getByTestId('tool-edit-save').click();
    await expect(edit.getByTestId('tool-edit-stale')).toContainText('Someone else changed this tool');
    await edit.getByTestId('tool-edit-reload').click();
    await expect(edit.getByTestId('tool-form-name')).toHaveValue('Finch head (renamed)');
    await edit.getByTestId('tool-form-storageLocation').fill('Harbourline bay D, rack 9');
    await edit.getByTestId('tool-edit-save').click();

    detail = page.getByTestId('tool-detail');
    await expect(detail.getByTestId('tool-saved')).toBeVisible();
    await expect(detail).toContainText('Harbourline bay D, rack 9');

    // Scrap it: a confirmation that says it cannot be undone, then a read-only record.
    await detail.getByTestId('tool-retention-record').click();
    await detail.getByTestId('tool-retention-decision-choice-scrap').click();
    await detail.getByTestId('tool-retention-continue').click();
    await expect(detail.getByTestId('tool-retention-note-error')).toContainText('Say why');
    await detail.getByTestId('tool-retention-note').fill('Test tool: no product needs it');
    await detail.getByTestId('tool-retention-continue').click();
    await expect(detail.getByTestId('tool-retention-confirm')).toContainText('This cannot be undone');
    await detail.getByTestId('tool-retention-confirm').scrollIntoViewIfNeeded();
    await page.screenshot({ path: `shots/${info.project.name}-tool-scrap-confirm.png`, fullPage: true });
    await detail.getByTestId('tool-retention-confirm-confirm').click();
    await expect(detail.getByTestId('tool-read-only')).toContainText('read-only');
    await expect(detail.getByTestId('tool-status')).toHaveText('Disposed');
    await expect(detail.getByTestId('tool-edit')).toHaveCount(0);
    await expect(detail.getByTestId('tool-retention-record')).toHaveCount(0);
  });
});
