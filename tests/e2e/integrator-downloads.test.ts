import { createHash } from 'node:crypto';
import fs from 'node:fs';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import {
  DESKTOP,
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

describe('an integrator downloads a release, checks its checksum and compares releases', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
    // A second release in which liquid water's ΔfH° moved by 0.5 kJ/mol (test data), published
    // through the release service before the browser first reads the release list.
    const editor = (await s.t.db.pool.query(`select id from users where login = 'demo-editor'`))
      .rows[0] as { id: number };
    const releases = createReleasesService(s.t.db.db);
    await s.t.db.db.transaction(async (tx) => {
      await tx.execute(`
        with old as (
          update revisions r set status = 'superseded', status_changed_at = now()
          from species_phases sp join species s on s.id = sp.species_id
          where sp.id = r.species_phase_id and s.key = 'water' and sp.phase = 'l'
            and r.quantity = 'formation_enthalpy' and r.status = 'accepted'
          returning r.*)
        insert into revisions (species_phase_id, kind, quantity, value, uncertainty,
          uncertainty_basis, method, standard_pressure, source_id, status, supersedes_id)
        select species_phase_id, kind, quantity, value + 500, uncertainty,
          uncertainty_basis, method, standard_pressure, source_id, 'accepted', id from old`);
      await releases.createDraftIn(tx, editor, '2026.2', 'Water revised (test data)');
      await releases.publishIn(tx, editor, '2026.2');
    });
  });
  afterAll(() => s.close());

  it('downloads the CSV of 2026.1 and finds the SHA-256 the page shows', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('link', { name: /sign in/i })
      .first()
      .click();
    await page.waitForURL(/\/login\/oauth\/authorize/);
    await page.getByRole('link', { name: /demo-reader/ }).click();
    await page.waitForURL(`${baseUrl}/`);
    await page.getByText('Tomas Reyes').waitFor();

    await page.getByRole('link', { name: 'Releases', exact: true }).click();
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
});
