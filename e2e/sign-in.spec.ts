import { demoUsers, expect, signIn, test } from './fixtures';

test.describe('sign-in', () => {
  for (const user of demoUsers) {
    test(`when ${user.role} signs in, then the inbox opens, Me shows them, and sign-out returns to sign-in`, async ({ page }, info) => {
      await page.goto('/');
      await expect(page).toHaveURL(/\/sign-in$/);
      await signIn(page, user.email);

      await expect(page).toHaveURL(/\/inbox$/);
      await expect(page.getByTestId('inbox-empty').or(page.getByTestId('inbox-list'))).toBeVisible();
      if (user.role === 'designer') {
        // Fonts ship with the app: loaded from this server, never fetched from elsewhere.
        expect(await page.evaluate(() => document.fonts.check('16px IBMPlexSans_400Regular'))).toBe(true);
        await page.screenshot({ path: `shots/${info.project.name}-inbox.png` });
      }

      await page.getByTestId('tab-me').click();
      await expect(page).toHaveURL(/\/me$/);
      await expect(page.getByTestId('me-email')).toHaveText(user.email);
      await expect(page.getByTestId('me-role')).toHaveText(user.roleLabel);
      await expect(page.getByTestId('me-admin-link')).toHaveCount(user.role === 'admin' ? 1 : 0);
      await page.screenshot({ path: `shots/${info.project.name}-me-${user.role}.png` });

      await page.getByTestId('sign-out').click();
      await expect(page).toHaveURL(/\/sign-in$/);
      await expect(page.getByTestId('sign-in-submit')).toBeVisible();

      // The session is really gone: a signed-in page sends us back to sign-in.
      await page.goto('/me');
      await expect(page).toHaveURL(/\/sign-in\?next=%2Fme$/);
    });
  }

  test('when the password is wrong, then the form shows the server message and stays on sign-in', async ({ page }, info) => {
    await page.goto('/sign-in');
    await signIn(page, 'engineer@kestrelbay.example', 'not-the-password');
    await expect(page.getByTestId('sign-in-form-error')).toContainText('Wrong e-mail or password');
    await expect(page).toHaveURL(/\/sign-in$/);
    await page.screenshot({ path: `shots/${info.project.name}-sign-in-wrong-password.png` });
  });

  test('when fields are empty or malformed, then each field says what to fix before anything is sent', async ({ page }) => {
    let sent = 0;
    page.on('request', (r) => {
      if (r.url().includes('/api/auth/sign-in')) sent += 1;
    });
    await page.goto('/sign-in');
    await page.getByTestId('sign-in-email').fill('not-an-address');
    await page.getByTestId('sign-in-submit').click();
    await expect(page.getByTestId('sign-in-email-error')).toHaveText('Enter a valid e-mail address');
    await expect(page.getByTestId('sign-in-password-error')).toHaveText('Enter your password');
    expect(sent).toBe(0);
  });

  test('when a signed-out visitor opens a deep link, then after sign-in they land on it', async ({ page }) => {
    await page.goto('/tools');
    await expect(page).toHaveURL(/\/sign-in\?next=%2Ftools$/);
    await signIn(page, 'toolmaker@harbourline.example');
    await expect(page).toHaveURL(/\/tools$/);
    await expect(page.getByTestId('tools-screen')).toBeVisible();
  });

  test('when a signed-in user opens /sign-in, then they go to the inbox', async ({ page }) => {
    await page.goto('/sign-in');
    await signIn(page, 'brandlead@kestrelbay.example');
    await expect(page).toHaveURL(/\/inbox$/);
    await page.goto('/sign-in');
    await expect(page).toHaveURL(/\/inbox$/);
  });

  test('when an address matches no page, then our own not-found words show', async ({ page }) => {
    await page.goto('/no-such-place');
    await expect(page.getByTestId('not-found')).toContainText('No page at this address');
  });
});
