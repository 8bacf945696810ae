import { acceptFormationValueIn } from '../../server/src/db/accepted-revisions';
import {
  DESKTOP,
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInTo,
  type BrowserSession,
} from '../support/browser';

describe('an editor composes and publishes a release', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
    // Two values accepted since 2026.1, as approvals leave them (invented test numbers).
    const q = (text: string, params: unknown[]) => s.t.db.pool.query(text, params);
    const phase = async (key: string) =>
      (
        await q(
          `select sp.id from species_phases sp join species s on s.id = sp.species_id
           where s.key = $1 and sp.phase = 'g' and sp.modification is null`,
          [key],
        )
      ).rows[0].id as number;
    const sourceId = (await q(`select min(id) as id from sources`, [])).rows[0].id as number;
    for (const [key, value] of [
      ['methane', '-74600'],
      ['propane', '-104100'],
    ] as const) {
      const speciesPhaseId = await phase(key);
      await s.t.db.db.transaction((tx) =>
        acceptFormationValueIn(tx, {
          speciesPhaseId,
          value,
          uncertainty: '300',
          method: 'evaluated',
          sourceId,
          notes: 'browser test value',
          createdBy: null,
        }),
      );
    }
  });
  afterAll(() => s.close());

  it('starts a draft, leaves a change out, publishes with confirmation and finds it in the list', async () => {
    const { page, baseUrl } = s;
    await signInTo(s, 'demo-editor', '/releases/drafts');
    await page.getByRole('heading', { name: 'Release drafts' }).waitFor();

    await page.getByLabel('Version').fill('2026.2');
    await page.getByLabel('Release notes').fill('Methane re-evaluated.');
    await page.getByRole('button', { name: /Start draft/ }).click();
    await page.waitForURL(`${baseUrl}/releases/drafts/2026.2`);
    await page.getByRole('heading', { name: 'Changed values (2)' }).waitFor();
    await page.getByText('−74.87 kJ/mol').waitFor();

    // Leave propane out for a later release. The demo data's one accepted value waiting for the
    // next release (an added species) stays in, so two changes remain.
    await page.getByRole('heading', { name: 'Added values (1)' }).waitFor();
    await page.getByRole('checkbox', { name: /Include Propane/ }).uncheck();
    await page.getByText('2 included').waitFor();
    await screenshot(page, 'release-compose-draft');

    // At phone width the page fits; the change table scrolls inside its own box.
    await page.setViewportSize(PHONE);
    await page.getByRole('heading', { name: 'Changed values (2)' }).waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'release-compose-draft-phone');
    await page.setViewportSize(DESKTOP);

    await page.getByRole('button', { name: /Publish 2026\.2/ }).click();
    const dialog = page.getByRole('dialog', { name: 'Publish release 2026.2?' });
    await dialog.getByText('2 changes to 2026.1').waitFor();
    await screenshot(page, 'release-compose-confirm');
    await dialog.getByRole('button', { name: 'Publish' }).click();

    await page.waitForURL(`${baseUrl}/releases`);
    await page.getByText('Release 2026.2 is published').waitFor();
    await page.getByText('2026.2').first().waitFor();
    await screenshot(page, 'release-compose-published');

    const pinned = await s.t.db.pool.query(
      `select s.key, r.value::text from release_entries e
       join releases rel on rel.id = e.release_id and rel.version = '2026.2'
       join revisions r on r.id = e.revision_id
       join species_phases sp on sp.id = e.species_phase_id join species s on s.id = sp.species_id
       where s.key in ('methane', 'propane') and sp.phase = 'g' and e.quantity = 'formation_enthalpy'`,
    );
    const values = Object.fromEntries(pinned.rows.map((r) => [r.key, r.value]));
    expect(values.methane).toBe('-74600');
    expect(values.propane).not.toBe('-104100');
    expect(s.problems).toEqual([]);
  });
});
