import type { Page } from '@playwright/test';
import { expect, signInAs, test } from './fixtures';

// The numbers behind the demo cut (KB-T-0412 visor ridge for Storm Kite, seeded with an estimate):
// the brand lead reads the verdict and figures on a phone; the tooling engineer changes the cost
// and sees the figures move before saving; the tool shows its life against all open plans.

const LEAD = 'brandlead@kestrelbay.example';
const ENGINEER = 'engineer@kestrelbay.example';
const TITLE = 'Raised visor ridge on the Kite head for Storm Kite';

async function demoRequestId(page: Page) {
  const res = await page.request.get('/api/requests', { params: { q: 'visor ridge' } });
  const body = (await res.json()) as { data: { id: string; title: string; tool: { id: string } }[] };
  const r = body.data.find((x) => x.title === TITLE);
  if (!r) throw new Error('demo request missing');
  return r;
}

test('when the brand lead opens the demo cut, then the verdict in words leads the numbers', async ({ page }, info) => {
  await signInAs(page, LEAD);
  const r = await demoRequestId(page);
  await page.goto(`/requests/${r.id}`);
  const screen = page.getByTestId('request-detail');
  const card = screen.getByTestId('numbers-card');
  await expect(card.getByTestId('numbers-card-verdict-sentence')).toHaveText(/Pays back after [\d,]+ units of 60,000 planned/);
  await expect(card.getByTestId('numbers-card-cost')).toHaveText(/^\$[\d,]+\.\d\d$/);
  await expect(card.getByTestId('numbers-card-life-title')).toHaveText('The tool lasts the run');
  await expect(screen.getByTestId('request-numbers-read-only')).toBeVisible();
  await expect(screen.getByTestId('request-numbers-edit')).toHaveCount(0);
  await card.getByTestId('numbers-card-verdict').evaluate((el) => el.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: `shots/${info.project.name}-numbers-card.png` });
  if (info.project.name === 'phone') {
    await card.getByTestId('numbers-card-more').click();
    await expect(card.getByTestId('numbers-landed')).toHaveText('$3.47');
    await card.getByTestId('numbers-buildup').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await page.screenshot({ path: `shots/${info.project.name}-numbers-card-open.png` });
  } else {
    await card.getByTestId('numbers-checks').evaluate((el) => el.scrollIntoView({ block: 'start' }));
    await page.screenshot({ path: `shots/${info.project.name}-numbers-card-checks.png` });
  }
});

test('when the engineer changes the cost, then the figures move at once and stay after saving', async ({ page }, info) => {
  await signInAs(page, ENGINEER);
  const r = await demoRequestId(page);
  await page.goto(`/requests/${r.id}`);
  const screen = page.getByTestId('request-detail');
  await screen.getByTestId('request-numbers-edit').click();
  const cost = screen.getByTestId('estimate-modificationCost');
  const before = await cost.inputValue();
  await cost.fill('13,320.00');
  // 1,332,000 cents / (680 - 347) = 4,000 units exactly (Storm Kite prices, freight 0.22).
  await expect(screen.getByTestId('numbers-live-verdict-sentence')).toHaveText('Pays back after 4,000 units of 60,000 planned');
  await expect(screen.getByTestId('numbers-live-live')).toBeVisible();
  await page.screenshot({ path: `shots/${info.project.name}-numbers-form.png` });
  await screen.getByTestId('estimate-form-save').click();
  await expect(screen.getByTestId('numbers-card').getByTestId('numbers-card-verdict-sentence')).toHaveText('Pays back after 4,000 units of 60,000 planned');
  // Put the demo figure back.
  await screen.getByTestId('request-numbers-edit').click();
  await screen.getByTestId('estimate-modificationCost').fill(before);
  await screen.getByTestId('estimate-form-save').click();
  await expect(screen.getByTestId('numbers-card').getByTestId('numbers-card-cost')).toHaveText(`$${before}`);
});

test('when the tool opens, then its life stands against all open plans', async ({ page }, info) => {
  await signInAs(page, LEAD);
  const r = await demoRequestId(page);
  await page.goto(`/tools/${r.tool.id}`);
  const screen = page.getByTestId('tool-detail');
  // Other specs may add drafts on this tool in the same run: the card must agree with the API,
  // and the total includes at least the demo request's plan (30,900 shots).
  const plans = (await (await page.request.get(`/api/tools/${r.tool.id}/open-plans`)).json()) as { total: { totalShots: number } };
  expect(plans.total.totalShots).toBeGreaterThanOrEqual(30_900);
  await expect(screen.getByTestId('open-plans-verdict')).toContainText('The tool lasts all open plans');
  await expect(screen.getByTestId('open-plans-total')).toHaveText(plans.total.totalShots.toLocaleString('en-US'));
  await screen.getByTestId('open-plans-section').evaluate((el) => el.scrollIntoView({ block: 'start' }));
  await page.screenshot({ path: `shots/${info.project.name}-open-plans.png` });
});
