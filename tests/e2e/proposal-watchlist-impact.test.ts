import { as, row, sourceId, submitted, valueItem } from '../support/proposals';
import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

describe('the proposal page shows the reviewer how a proposal moves their watchlists', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser(PHONE);
  });
  afterAll(() => s.close());

  it('lists the moved reactions, flagged in words, at phone width; an empty state for others', async () => {
    const { page, baseUrl, t } = s;
    const curator = await as(t, 'demo-curator');
    const editor = await as(t, 'demo-editor');
    const water = Number(
      (
        await row(
          t,
          `select r.value from revisions r join species_phases sp on sp.id = r.species_phase_id
           join species s on s.id = sp.species_id
           where s.key = 'water' and sp.phase = 'l' and r.quantity = 'formation_enthalpy'
             and r.status = 'accepted'`,
        )
      ).value,
    );
    const id = await submitted(curator, [
      valueItem(await sourceId(t), {
        species: 'water',
        phase: 'l',
        value: water + 1000,
        unit: 'J/mol',
        uncertainty: 40,
      }),
    ]);
    await editor
      .post('/api/v1/me/watchlists', {
        name: 'Boiler duties',
        reactions: [
          { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', label: 'hydrogen burned to liquid water' },
          { equation: 'C(graphite) + O2(g) -> CO2(g)' },
        ],
      })
      .expect(201);

    await page.goto(
      `${baseUrl}/auth/github?login=demo-editor&returnTo=${encodeURIComponent(`/curation/proposals/${id}`)}`,
    );
    await page.getByRole('heading', { name: 'Your watchlists' }).waitFor();
    const panel = page.locator('thalpos-watchlist-impact-panel');
    await panel.getByText('hydrogen burned to liquid water').waitFor();
    await panel.getByText('+1 kJ/mol').waitFor();
    await panel.getByText(/larger than the combined uncertainty/).waitFor();
    // The unchanged reaction is left out.
    expect(await panel.locator('li').count()).toBe(1);
    await panel.scrollIntoViewIfNeeded();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'proposal-watchlist-impact-phone');

    // The author has no watchlists: a link to Integrate instead.
    await page.goto(
      `${baseUrl}/auth/github?login=demo-curator&returnTo=${encodeURIComponent(`/curation/proposals/${id}`)}`,
    );
    await page.getByText('You have no watchlists yet').waitFor();
    await page.getByRole('link', { name: 'Save the reactions you depend on' }).click();
    await page.waitForURL(`${baseUrl}/integrate`);
    expect(s.problems).toEqual([]);
  });
});
