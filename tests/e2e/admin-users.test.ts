import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

describe('admin changes a role in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('signs in through the provider chooser, changes a role, and the change survives a reload', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('link', { name: /sign in/i })
      .first()
      .click();

    // The local provider's chooser page, on its own origin.
    await page.waitForURL(/\/login\/oauth\/authorize/);
    await page.getByRole('link', { name: /demo-admin/ }).click();

    await page.waitForURL(`${baseUrl}/`);
    await page.getByText('Lena Sørensen').waitFor();

    await page.getByRole('link', { name: /admin/i }).first().click();
    await page.waitForURL(/\/admin\/users/);
    const select = page.getByRole('combobox', { name: 'Role for demo-reader' });
    await select.waitFor();
    await select.click();
    await page.getByRole('option', { name: 'curator' }).click();
    await page.getByText('Role of demo-reader changed to curator').waitFor();

    const stored = await s.t.db.pool.query(`select role from users where login = 'demo-reader'`);
    expect(stored.rows[0].role).toBe('curator');

    await page.reload();
    await page.getByRole('combobox', { name: 'Role for demo-reader' }).waitFor();
    await expect(
      page.getByRole('combobox', { name: 'Role for demo-reader' }).textContent(),
    ).resolves.toMatch(/curator/);
    await screenshot(page, 'admin-users');

    // At phone width the users table fits: nothing sticks out sideways.
    await page.setViewportSize(PHONE);
    await page.getByRole('combobox', { name: 'Role for demo-reader' }).waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'admin-users-phone');
    expect(s.problems).toEqual([]);
  });
});
