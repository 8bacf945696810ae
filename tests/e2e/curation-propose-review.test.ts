import {
  DESKTOP,
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInTo,
  type BrowserSession,
} from '../support/browser';
import { startReplacingValue } from '../support/proposal-form';

// An invented source of the demo team, labelled as demo data (never a real measurement).
const DEMO_BIBTEX = `@techreport{kpw2026methane,
  author = {Nandakumar, Priya and Brandt, Helga},
  title = {Combustion calorimetry of methane, run 12 (demo data)},
  institution = {Kestrel Process Works},
  year = {2026},
  number = {KPW-DEMO-12}
}`;

// The smallest file that reads as a PDF by its content.
const DEMO_PDF = Buffer.from(
  '%PDF-1.4\n1 0 obj <</Type /Catalog /Pages 2 0 R>> endobj\n' +
    '2 0 obj <</Type /Pages /Kids [] /Count 0>> endobj\ntrailer <</Root 1 0 R>>\n%%EOF\n',
);

describe('a curator proposes a value and an editor approves it', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('proposes with a BibTeX source and a PDF, then compares and approves', async () => {
    const { page, baseUrl } = s;

    // --- the curator builds the proposal ---
    await signInTo(s, 'demo-curator', '/curation/propose');
    await startReplacingValue(page, 'Newer combustion run of the demo team (demo data).', {
      species: 'methane',
      option: /Methane/,
      phase: 'gas',
    });

    // A typographic minus and a decimal comma, read as the shared number input reads them.
    await page.getByLabel('Item 1 value').fill('\u221275,9');
    await page.getByText('Stored as −75900 J/mol').waitFor();
    await page.getByLabel('Item 1 uncertainty').fill('0.4');
    await page.getByLabel('Method').fill('combustion calorimetry');

    await page.getByRole('button', { name: 'Add new source' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('tab', { name: 'BibTeX' }).click();
    await dialog.getByLabel('BibTeX entry').fill(DEMO_BIBTEX);
    await dialog.getByRole('button', { name: 'Add source' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page
      .getByRole('group', { name: 'Item 1 source' })
      .getByText(/Combustion calorimetry of methane/)
      .waitFor();

    await page.locator('thalpos-document-upload input[type=file]').setInputFiles({
      name: 'kpw-demo-run-12.pdf',
      mimeType: 'application/pdf',
      buffer: DEMO_PDF,
    });
    await page.getByText('kpw-demo-run-12.pdf attached.').waitFor();
    await screenshot(page, 'curation-propose');

    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/curation\/proposals\/\d+$/);
    const id = Number(/(\d+)$/.exec(page.url())?.[1]);
    await page.getByText('Waiting for review').first().waitFor();
    const stored = await s.t.db.pool.query(`select status from proposals where id = $1`, [id]);
    expect(stored.rows[0].status).toBe('submitted');

    // --- an editor finds it in the queue and compares ---
    await signInTo(s, 'demo-editor', '/curation/review');
    await page.getByRole('heading', { name: 'Review' }).waitFor();
    await page.getByRole('link', { name: `#${id}`, exact: true }).click();
    await page.waitForURL(`${baseUrl}/curation/proposals/${id}`);
    // Someone else's proposal is not among "My proposals": no curation tab claims this page.
    const curationTabs = page.getByRole('navigation', { name: 'Curation' });
    await curationTabs.getByRole('tab', { name: 'Review' }).waitFor();
    expect(await curationTabs.getByRole('tab', { selected: true }).count()).toBe(0);
    const comparison = page.getByRole('group', { name: 'Recorded and proposed value' });
    await comparison.getByRole('region', { name: 'Recorded now' }).waitFor();
    await comparison
      .getByRole('region', { name: 'Proposed' })
      .getByText('−75.9 ± 0.4 kJ/mol')
      .waitFor();
    await comparison.getByText('As entered: −75.9 kJ/mol').waitFor();
    // Either within 2 combined uncertainties, or a worded warning: never colour alone.
    await page
      .getByText(/Difference −|Large change:/)
      .first()
      .waitFor();
    await page.getByRole('link', { name: /kpw-demo-run-12\.pdf/ }).waitFor();
    await screenshot(page, 'curation-review-compare');

    // At phone width the comparison stacks and nothing sticks out sideways.
    await page.setViewportSize(PHONE);
    await comparison.waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'curation-review-compare-phone');
    await page.setViewportSize(DESKTOP);

    // --- the decision ---
    await page.getByRole('radio', { name: 'Approve' }).check();
    await page.getByLabel('Comment for the proposer').fill('Checked against the run log; fine.');
    await page.getByRole('button', { name: 'Approve', exact: true }).click();
    await page.getByText('Decision saved: Accepted.').waitFor();
    await page.getByText('Checked against the run log; fine.').waitFor();
    const decided = await s.t.db.pool.query(`select status from proposals where id = $1`, [id]);
    expect(decided.rows[0].status).toBe('approved');
    await screenshot(page, 'curation-review-approved');

    // The queue fits a phone too: its table scrolls inside its card.
    await page.goto(`${baseUrl}/curation/review`);
    await page.setViewportSize(PHONE);
    await page.getByRole('table', { name: 'Review queue' }).waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'curation-review-queue-phone');
    await page.setViewportSize(DESKTOP);
    expect(s.problems).toEqual([]);
  });
});
