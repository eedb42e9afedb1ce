// Shared Playwright fixtures: every test fails on a request that leaves the local server
// (fonts, CDNs, telemetry...) or on an uncaught page error.
import { expect, test as base, type Page } from '@playwright/test';

export const DEMO_PASSWORD = 'toolgate-demo';

export const demoUsers = [
  { role: 'designer', email: 'designer@kestrelbay.example', name: 'Wren Okafor', roleLabel: 'Designer' },
  { role: 'engineer', email: 'engineer@kestrelbay.example', name: 'Tomas Ilves', roleLabel: 'Tooling engineer' },
  { role: 'brand_lead', email: 'brandlead@kestrelbay.example', name: 'Priya Halloran', roleLabel: 'Brand lead' },
  { role: 'toolmaker', email: 'toolmaker@harbourline.example', name: 'Chen Weiling', roleLabel: 'Toolmaker' },
  { role: 'admin', email: 'admin@kestrelbay.example', name: 'Sam Dubois', roleLabel: 'Administrator' },
] as const;

export const test = base.extend<{ problems: string[] }>({
  problems: [
    async ({ page, baseURL }, use) => {
      const problems: string[] = [];
      const host = new URL(baseURL!).host;
      page.on('request', (r) => {
        const u = new URL(r.url());
        if (!['data:', 'blob:'].includes(u.protocol) && u.host !== host) problems.push(`foreign request: ${r.url()}`);
      });
      page.on('pageerror', (e) => problems.push(`pageerror: ${e.message}`));
      await use(problems);
      expect(problems).toEqual([]);
    },
    { auto: true },
  ],
});
export { expect };

/** Fills and submits the sign-in form (the page must show it). */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
}

/** Signs in from a fresh page and waits for the inbox. */
export async function signInAs(page: Page, email: string) {
  await page.goto('/sign-in');
  await signIn(page, email);
  await expect(page).toHaveURL(/\/inbox$/);
}
