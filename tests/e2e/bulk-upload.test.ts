import fs from 'node:fs';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';
import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  signInTo,
  type BrowserSession,
} from '../support/browser';

// The demo samples: invented numbers of the Kestrel Process Works scenario (demo data only).
const sample = (name: string) => ({
  name,
  mimeType: 'text/csv',
  buffer: fs.readFileSync(path.join(PROJECT_ROOT, 'imports/samples', name)),
});

describe('a curator bulk-uploads a CSV', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('sees a row error in the dry run, uploads the fixed file, submits and lands on the proposal', async () => {
    const { page, baseUrl } = s;
    await signInTo(s, 'demo-curator', '/curation/proposals');
    await page.getByRole('tab', { name: 'Bulk upload' }).click();
    await page.waitForURL(`${baseUrl}/proposals/upload`);
    await page.getByRole('heading', { name: 'Bulk upload' }).waitFor();

    // The file with mistakes: the dry run explains each and submitting stays off.
    const picker = page.getByLabel('Choose a CSV or XML file');
    await picker.setInputFiles(sample('kpw-demo-formation-errors.csv'));
    await page.getByText('6 rows have errors').waitFor();
    const misspelt = page.getByRole('row').filter({ hasText: 'tolune' });
    await misspelt.getByText('species: unknown species key tolune').waitFor();
    expect(await misspelt.getAttribute('class')).toContain('has-error');
    await page
      .getByRole('row')
      .filter({ hasText: 'carbon (cr,graphite)' })
      .getByText(/reference state/)
      .waitFor();
    expect(await page.getByRole('button', { name: 'Submit as proposal' }).isDisabled()).toBe(true);
    await screenshot(page, 'bulk-upload-dry-run-errors');

    // The fixed file is clean; submitting saves one draft proposal with every row.
    await picker.setInputFiles(sample('kpw-demo-formation.csv'));
    await page.getByText('Every row is clean').waitFor();
    expect(await page.getByRole('row').filter({ hasText: 'Replaces current value' }).count()).toBe(
      2,
    );
    expect(await page.getByRole('row').filter({ hasText: 'New value' }).count()).toBe(3);
    await page.getByLabel('Rationale').fill('Demo bench campaign 2026, solvents (demo data).');
    await screenshot(page, 'bulk-upload-dry-run-clean');
    const submit = page.getByRole('button', { name: 'Submit as proposal' });
    expect(await submit.isEnabled()).toBe(true);
    await submit.click();
    const open = page.getByRole('link', { name: /Open proposal #\d+/ });
    await open.waitFor();
    await page.getByText(/Saved 5 rows as 5 items of draft proposal #\d+/).waitFor();
    await screenshot(page, 'bulk-upload-created');

    const id = /#(\d+)/.exec((await open.textContent()) ?? '')![1];
    await open.click();
    await page.waitForURL(`${baseUrl}/curation/proposals/${id}`);
    await page.getByRole('heading', { name: `Proposal #${id}` }).waitFor();
    await page.getByText('Demo bench campaign 2026, solvents (demo data).').first().waitFor();
    await screenshot(page, 'bulk-upload-proposal');
    expect(s.problems).toEqual([]);
  });
});

describe('bulk upload at phone width', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser(PHONE);
  });
  afterAll(() => s.close());

  it('shows the dry run without pushing the page sideways', async () => {
    const { page } = s;
    await signInTo(s, 'demo-curator', '/proposals/upload');
    await page
      .getByLabel('Choose a CSV or XML file')
      .setInputFiles(sample('kpw-demo-formation-errors.csv'));
    await page.getByText('6 rows have errors').waitFor();
    expect(await sidewaysOverflow(page, 1)).toBeLessThanOrEqual(1);
    // Each row's problems wrap inside its card instead of running out of view.
    const problems = await page
      .locator('ul.problems li')
      .evaluateAll((items) => items.map((li) => li.getBoundingClientRect().right));
    expect(problems.length).toBeGreaterThan(0);
    for (const right of problems) expect(right).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, 'bulk-upload-phone');
    expect(s.problems).toEqual([]);
  });
});
