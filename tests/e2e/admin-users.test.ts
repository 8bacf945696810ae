import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInFromHome,
  type BrowserSession,
} from '../support/browser';

describe('admin changes a role in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('signs in through the provider chooser, changes a role, and the change survives a reload', async () => {
    const { page } = s;
    await signInFromHome(s, 'demo-admin', 'Lena Sørensen');

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
