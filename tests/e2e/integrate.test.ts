import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInFromHome,
  type BrowserSession,
} from '../support/browser';
import { publishRevisedWater } from '../support/releases';

describe('an integrator on the Integrate screen', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
    // 2026.2, where liquid water's ΔfH° moved by 0.5 kJ/mol, before the page reads the releases.
    await publishRevisedWater(s.t);
  });
  afterAll(() => s.close());

  it('creates a token, copies it once, reads the API with it and revokes it', async () => {
    const { page, baseUrl } = s;
    await signInFromHome(s, 'demo-reader', 'Tomas Reyes');

    await page.getByRole('link', { name: 'Integrate' }).click();
    await page.waitForURL(/\/integrate$/);
    await page.getByRole('heading', { name: /API tokens/ }).waitFor();
    await page.getByText('No tokens yet').waitFor();

    await page.getByRole('textbox', { name: 'Token name' }).fill('Kestrel simulator sync');
    await page.getByRole('button', { name: 'Create token' }).click();

    // Shown once, in a dialog that says so, with a copy button.
    const dialog = page.getByRole('dialog');
    await dialog.getByText('you will not see it again').waitFor();
    const token = (await dialog.getByTestId('new-token').textContent())?.trim() ?? '';
    expect(token).toMatch(/^thp_[0-9a-f]{16}_[A-Za-z0-9_-]{43}$/);
    await dialog.getByRole('button', { name: 'Copy token' }).click();
    await dialog.getByRole('button', { name: 'Copied' }).waitFor();
    await screenshot(page, 'integrate-token-created');
    await dialog.getByRole('button', { name: 'Done' }).click();
    await dialog.waitFor({ state: 'detached' });
    await expect(page.content()).resolves.not.toContain(token);

    // The token reads the API on its own, as a script would.
    const me = await fetch(`${baseUrl}/api/v1/me`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    expect(me.status).toBe(200);
    expect(((await me.json()) as { login: string }).login).toBe('demo-reader');

    // Its last use shows after a reload.
    await page.reload();
    const row = page.getByRole('listitem').filter({ hasText: 'Kestrel simulator sync' });
    await row.waitFor();
    await row.getByText(/Last used \d{4}-\d{2}-\d{2}/).waitFor();
    await screenshot(page, 'integrate');

    // At phone width the screen fits: nothing sticks out sideways.
    await page.setViewportSize(PHONE);
    await row.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'integrate-phone');

    await row.getByRole('button', { name: 'Revoke Kestrel simulator sync' }).click();
    const confirm = page.getByRole('dialog');
    await confirm.getByText('cannot be undone').waitFor();
    await confirm.getByRole('button', { name: 'Revoke' }).click();
    await page.getByText('Token “Kestrel simulator sync” revoked').waitFor();
    await page.getByText('No tokens yet').waitFor();

    const after = await fetch(`${baseUrl}/api/v1/me`, {
      headers: { Authorization: `Bearer ${token}` },
    });
    expect(after.status).toBe(401);
    expect(((await after.json()) as { error: { code: string } }).error.code).toBe('invalid_token');
    expect(s.problems).toEqual([]);
  });

  it('keeps a watchlist and runs its impact report between two releases', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize({ width: 1366, height: 900 });
    await page.goto(`${baseUrl}/integrate`);
    await page.getByRole('button', { name: 'New watchlist' }).click();
    await page.getByRole('textbox', { name: 'Watchlist name' }).fill('Boiler feed');
    await page.getByRole('textbox', { name: 'Reaction 1' }).fill('H2(g) + 1/2 O2(g) -> H2O(l)');
    await page.getByRole('textbox', { name: 'Label (optional)' }).fill('hydrogen combustion');
    await page.getByRole('button', { name: 'Add reaction' }).click();
    await page.getByRole('textbox', { name: 'Reaction 2' }).fill('C(graphite) + O2(g) -> CO2(g)');
    await page.getByRole('button', { name: 'Save watchlist' }).click();
    await page.getByText('Watchlist “Boiler feed” saved').waitFor();

    await page.getByRole('combobox', { name: 'From release' }).getByText('2026.1').waitFor();
    await page.getByRole('combobox', { name: 'To release' }).getByText('2026.2').waitFor();
    await page.getByRole('button', { name: 'Run impact report' }).click();
    const table = page.getByRole('table', { name: 'Impact report' });
    await table.waitFor();
    const flagged = table.locator('tr.exceeds');
    await flagged.getByText('hydrogen combustion').waitFor();
    expect(await flagged.count()).toBe(1);
    await expect(flagged.textContent()).resolves.toContain('0.5');
    await screenshot(page, 'integrate-impact');

    await page.setViewportSize(PHONE);
    await table.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'integrate-impact-phone');
    expect(s.problems).toEqual([]);
  });
});
