import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInFromHome,
  type BrowserSession,
} from '../support/browser';
import { waitFor } from '../support/mail';

describe('settings and the audit log in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('an editor turns e-mail off in Settings, then reads the audit of curated data', async () => {
    const { page } = s;
    await signInFromHome(s, 'demo-editor', 'Helga Brandt');

    // Settings, from the account menu.
    await page.getByRole('button', { name: 'Account menu' }).click();
    await page.getByRole('menuitem', { name: /Settings/ }).click();
    await page.waitForURL(/\/settings$/);
    const toggle = page.getByRole('switch', { name: 'E-mail me about proposals' });
    await toggle.waitFor();
    expect(await toggle.getAttribute('aria-checked')).toBe('true');
    await page.getByText('Messages go to helga.brandt@kestrel.example').waitFor();
    await toggle.click();
    await page.getByText('E-mail notifications are off').waitFor();
    const stored = await s.t.db.pool.query(
      `select email_notifications from users where login = 'demo-editor'`,
    );
    expect(stored.rows[0].email_notifications).toBe(false);
    await page.reload();
    await page.getByRole('switch', { name: 'E-mail me about proposals' }).waitFor();
    expect(
      await page
        .getByRole('switch', { name: 'E-mail me about proposals' })
        .getAttribute('aria-checked'),
    ).toBe('false');
    await screenshot(page, 'settings');

    // The audit log: curated data only for an editor; filter to releases, open a row.
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Audit log' })
      .click();
    await page.waitForURL(/\/audit$/);
    await page.getByText('Accounts and sign-ins are visible to admins only').waitFor();
    const table = page.getByRole('table', { name: 'Audit log' });
    await table.getByRole('row').nth(1).waitFor();
    expect(await table.getByText('user.settings_changed').count()).toBe(0);

    await page.getByRole('combobox', { name: 'Record type' }).click();
    await page.getByRole('option', { name: 'release', exact: true }).click();
    await page.getByRole('button', { name: /Apply filters/ }).click();
    // The previous rows stay on screen while the filtered page loads: wait for it to replace them.
    const actions = await waitFor(async () => {
      const shown = await table.locator('td.mat-column-action').allTextContents();
      return shown.length > 0 && shown.every((a) => a.trim().startsWith('release.')) && shown;
    });
    expect(actions.map((a) => a.trim())).toContain('release.published');

    await table
      .getByRole('button', { name: /^Before and after of entry/ })
      .first()
      .click();
    await table.getByRole('heading', { name: 'After' }).waitFor();
    await screenshot(page, 'audit-log');

    await page.setViewportSize(PHONE);
    await table.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    // Each entry's before-and-after button stays on the screen, not in a part scrolled away.
    const button = table.getByRole('button', { name: /^Before and after of entry/ }).first();
    await page.waitForFunction(
      `(() => { const b = document.querySelector('table[aria-label="Audit log"] button');
        return !!b && b.getBoundingClientRect().right <= ${PHONE.width}; })()`,
    );
    expect((await button.boundingBox())!.x).toBeLessThan(PHONE.width);
    await screenshot(page, 'audit-log-phone');
    expect(s.problems).toEqual([]);
  });
});
