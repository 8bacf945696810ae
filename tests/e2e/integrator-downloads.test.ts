import { createHash } from 'node:crypto';
import fs from 'node:fs';
import {
  DESKTOP,
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInFromHome,
  type BrowserSession,
} from '../support/browser';
import { releaseImpactMail } from '../../server/src/modules/releases/release-mail';
import { publishRevisedWater } from '../support/releases';

describe('an integrator downloads a release, checks its checksum and compares releases', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
    // 2026.2, where liquid water's ΔfH° moved by 0.5 kJ/mol, before the page reads the releases.
    await publishRevisedWater(s.t);
  });
  afterAll(() => s.close());

  it('downloads the CSV of 2026.1 and finds the SHA-256 the page shows', async () => {
    const { page } = s;
    await signInFromHome(s, 'demo-reader', 'Tomas Reyes');

    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Releases', exact: true })
      .click();
    await page.waitForURL(/\/releases$/);
    const card = page.getByRole('article', { name: /Release 2026\.1/ });
    const downloads = card.getByRole('list', { name: 'Downloads of release 2026.1' });
    const csvItem = downloads.getByRole('listitem').filter({ hasText: 'CSV' });
    const shown = (await csvItem.locator('code').textContent())?.trim() ?? '';
    expect(shown).toMatch(/^[0-9a-f]{64}$/);

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      csvItem.getByRole('link', { name: /CSV/ }).click(),
    ]);
    expect(download.suggestedFilename()).toBe('thalpos-2026.1.csv');
    const file = fs.readFileSync(await download.path());
    expect(file.toString('utf8')).toMatch(/^section,species_key,species_name,/);
    expect(createHash('sha256').update(file).digest('hex')).toBe(shown);
    await screenshot(page, 'integrator-downloads');

    await page.setViewportSize(PHONE);
    await csvItem.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'integrator-downloads-phone');
    expect(s.problems).toEqual([]);
  });

  it('opens the diff between 2026.1 and 2026.2 and sees the changed row', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize(DESKTOP);
    await page.goto(`${baseUrl}/releases`);
    await page
      .getByRole('article', { name: /Release 2026\.2/ })
      .getByRole('link', { name: 'What changed since 2026.1' })
      .click();
    await page.waitForURL(`${baseUrl}/releases/2026.1/diff/2026.2`);
    const title = page.getByRole('heading', { name: /2026\.1 → 2026\.2/ });
    await title.waitFor();
    expect((await title.textContent())?.replace(/\s+/g, ' ')).toMatch(
      // Water's value; other accepted test-data revisions may be added too.
      /: 1 changed, \d+ added, 0 removed/,
    );
    const table = page.getByRole('table', { name: 'Changes' });
    const row = table.getByRole('row').filter({ hasText: 'Water' });
    await row.waitFor();
    await row.getByText('changed').waitFor();
    await row.getByText(/0\.5/).first().waitFor();
    await screenshot(page, 'integrator-diff');

    await page.setViewportSize(PHONE);
    await row.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'integrator-diff-phone');
    expect(s.problems).toEqual([]);
  });

  it('follows the publish e-mail’s comparison link to the same page', async () => {
    const { page, baseUrl } = s;
    const mail = releaseImpactMail(
      {
        owner: { id: 1, login: 'demo-reader', name: 'Reader', email: null },
        watchlist: { id: 1, name: 'Boiler feed' },
        report: {
          ...{ from: '2026.1', to: '2026.2', unit: 'kJ/mol', watchlistId: 1 },
          ...{ count: 0, errors: 0, exceeding: 0, results: [], caution: '' },
        },
      },
      baseUrl,
    );
    const link = /Compare the releases: (\S+)/.exec(mail.text)![1]!;
    await page.goto(link);
    await page.getByRole('heading', { name: /2026\.1 → 2026\.2/ }).waitFor();
    expect(s.problems).toEqual([]);
  });
});
