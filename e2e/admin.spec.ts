import { expect, signInAs, test } from './fixtures';

// Each run makes its own rows (unique names), so the spec can run against any seeded database.
const stamp = () => `${Date.now().toString(36)}${Math.floor(Math.random() * 1e4)}`;

test.describe('administration', () => {
  test('when an admin invites a toolmaker, then the invitation is confirmed and the user is listed as invited', async ({ page }, info) => {
    const id = stamp();
    const email = `toolmaker-${id}@harbourline.example`;
    await signInAs(page, 'admin@kestrelbay.example');
    await page.getByTestId('tab-me').click();
    await page.getByTestId('me-admin-link').click();
    await expect(page).toHaveURL(/\/admin$/);
    await page.screenshot({ path: `shots/${info.project.name}-admin-home.png` });
    await page.getByTestId('admin-users-link').click();
    await expect(page.getByTestId('user-row-designer@kestrelbay.example')).toBeVisible();
    await page.screenshot({ path: `shots/${info.project.name}-admin-users.png` });

    await page.getByTestId('user-new').click();
    await expect(page).toHaveURL(/\/admin\/users\/new$/);
    // The form says what is missing before anything is sent.
    await page.getByTestId('user-create-submit').click();
    await expect(page.getByTestId('user-name-error')).toHaveText('Enter the full name');

    await page.getByTestId('user-name').fill(`Ada Quill ${id}`);
    await page.getByTestId('user-email').fill(email);
    await page.getByTestId('user-role-toolmaker').click();
    await page.getByTestId('user-create-submit').click();
    await expect(page.getByTestId('user-factory-error')).toContainText('exactly one factory');
    await page.getByRole('radio', { name: /Harbourline Plastics/ }).click();
    // Picking the factory brings its time zone along.
    await expect(page.getByTestId('user-time-zone')).toHaveValue('Asia/Shanghai');
    await page.screenshot({ path: `shots/${info.project.name}-admin-user-new.png`, fullPage: true });
    await page.getByTestId('user-create-submit').click();
    await expect(page.getByTestId('user-invited')).toContainText(`Invitation sent to ${email}`);

    // The same address twice: the server's answer lands on the e-mail field.
    await page.getByTestId('user-name').fill('Ada Quill again');
    await page.getByTestId('user-email').fill(email);
    await page.getByTestId('user-create-submit').click();
    await expect(page.getByTestId('user-email-error')).toHaveText('Already in use');

    await page.goto('/admin/users');
    await page.getByTestId('user-search').fill(id);
    await expect(page.getByTestId('user-count')).toHaveText('1 user');
    await expect(page.getByTestId(`user-row-${email}`)).toContainText('Invited');
  });

  test('when an admin deactivates and reactivates a user, then the status follows after a confirmation', async ({ page }, info) => {
    const id = stamp();
    const email = `designer-${id}@kestrelbay.example`;
    await signInAs(page, 'admin@kestrelbay.example');
    await page.goto('/admin/users/new');
    await page.getByTestId('user-name').fill(`Bram Ostrander ${id}`);
    await page.getByTestId('user-email').fill(email);
    await page.getByRole('checkbox', { name: /Starling Rangers/ }).click();
    await page.getByTestId('user-create-submit').click();
    await expect(page.getByTestId('user-invited')).toBeVisible();
    await page.getByRole('link', { name: 'Open user' }).click();

    const detail = page.getByTestId('user-detail');
    await expect(detail.getByTestId('user-detail-email')).toHaveText(email);
    await detail.getByTestId('user-access-toggle').click();
    await expect(detail.getByTestId('user-access-confirm')).toContainText('Deactivate');
    await page.screenshot({ path: `shots/${info.project.name}-admin-user-detail.png`, fullPage: true });
    await detail.getByTestId('user-access-confirm-confirm').click();
    await expect(detail.getByTestId('user-access-toggle')).toHaveText(/Reactivate/);
    await expect(detail.getByText('Deactivated', { exact: true })).toBeVisible();

    await detail.getByTestId('user-access-toggle').click();
    await detail.getByTestId('user-access-confirm-confirm').click();
    await expect(detail.getByTestId('user-access-toggle')).toHaveText(/Deactivate/);

    // Role change: to engineer with the other brand as well.
    await detail.getByTestId('user-role-engineer').click();
    await page.getByRole('checkbox', { name: /Mudlark Racers/ }).click();
    await detail.getByTestId('user-save').click();
    await expect(detail.getByTestId('user-saved')).toBeVisible();
    await page.reload();
    // After a reload only this screen is mounted.
    await expect(page.getByRole('radio', { name: /Tooling engineer/ })).toHaveAttribute('aria-checked', 'true');
    await expect(page.getByRole('checkbox', { name: /Mudlark Racers/ })).toHaveAttribute('aria-checked', 'true');
  });

  test('when an admin adds a brand and a factory, then both appear in their lists', async ({ page }, info) => {
    const code = `Q${Math.floor(Math.random() * 9000 + 1000)}`;
    await signInAs(page, 'admin@kestrelbay.example');
    await page.goto('/admin/brands');
    await expect(page.getByTestId('brand-row-SR')).toContainText('Starling Rangers');
    await page.getByTestId('brand-code').fill(code.toLowerCase());
    await page.getByTestId('brand-name').fill(`Quarry Kites ${code}`);
    await page.getByTestId('brand-submit').click();
    await expect(page.getByTestId('brand-added')).toContainText(`Brand ${code} added`);
    await expect(page.getByTestId(`brand-row-${code}`)).toContainText(`Quarry Kites ${code}`);
    await page.screenshot({ path: `shots/${info.project.name}-admin-brands.png`, fullPage: true });

    await page.goto('/admin/factories');
    await page.getByTestId('factory-name').fill(`Lantern Bay Molding ${code}`);
    await page.getByTestId('factory-city').fill('Ningbo');
    await page.getByTestId('factory-country').fill('China');
    await page.getByTestId('factory-time-zone').fill('Mars/Olympus');
    await page.getByTestId('factory-submit').click();
    await expect(page.getByTestId('factory-time-zone-error')).toContainText('Not a time zone');
    await page.getByTestId('factory-time-zone').fill('Asia/Shanghai');
    await page.getByTestId('factory-submit').click();
    await expect(page.getByTestId('factory-added')).toContainText(`Lantern Bay Molding ${code} added`);
    await expect(page.getByTestId('factory-rows')).toContainText(`Lantern Bay Molding ${code}`);
    await page.screenshot({ path: `shots/${info.project.name}-admin-factories.png`, fullPage: true });
  });

  test('when a non-admin opens administration, then they read that it is not for their role', async ({ page }, info) => {
    await signInAs(page, 'engineer@kestrelbay.example');
    await page.goto('/admin/users');
    await expect(page.getByTestId('admin-not-for-role')).toContainText('Not for your role');
    await expect(page.getByTestId('admin-not-for-role')).toContainText('Tooling engineer');
    await page.screenshot({ path: `shots/${info.project.name}-admin-refused.png` });
  });
});
