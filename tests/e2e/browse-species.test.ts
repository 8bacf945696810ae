import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

describe('Browse and Species in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s?.close());

  it('finds a species by a misspelt name and opens its page with structure, values and sources', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Browse' })
      .click();
    await page.waitForURL(/\/browse/);
    await page.getByRole('heading', { name: 'Browse', exact: true }).waitFor();

    // The release's table fills in on its own, newest release first.
    const table = page.getByRole('table', { name: 'Species' });
    await table.getByRole('row').nth(1).waitFor();

    // "metylpropane": one letter missing, and the search still finds 2-methylpropane.
    await page.getByRole('searchbox', { name: 'Search species' }).fill('2-metylpropane');
    const results = page.getByRole('list', { name: 'Search results' });
    const hit = results.getByRole('link', { name: /2-Methylpropane/ });
    await hit.waitFor();
    await screenshot(page, 'browse-search');
    await hit.click();

    await page.waitForURL(/\/species\/2-methylpropane/);
    await page.getByRole('heading', { name: '2-Methylpropane', level: 1 }).waitFor();
    // C4H10 from the standard atomic weights: 4 × 12.011 + 10 × 1.008 = 58.124 g/mol.
    await expect(page.locator('.molar-mass').textContent()).resolves.toMatch(/^58\.12\d g\/mol$/);

    // The structure is drawn in the browser from its SMILES, under the app's own CSP.
    const picture = page.getByRole('img', { name: /Structure of 2-Methylpropane/ });
    await picture.waitFor();
    await page.waitForFunction(
      "(() => { const img = document.querySelector('thalpos-structure-picture img'); return !!img && img.complete && img.naturalWidth > 0; })()",
    );

    // ΔfH° per release as a chart and as a table; the revision history and the sources.
    await page.locator('thalpos-release-values canvas').waitFor();
    const values = page.getByRole('table', { name: 'ΔfH° by release' });
    await expect(values.getByRole('row').count()).resolves.toBeGreaterThan(1);
    await expect(values.textContent()).resolves.toContain('2026.1');
    const history = page.getByRole('table', { name: 'Revision history' });
    await expect(history.getByRole('row').count()).resolves.toBeGreaterThan(1);
    const sources = page.getByRole('heading', { name: 'Sources' });
    await sources.waitFor();
    await expect(page.locator('.sources li').count()).resolves.toBeGreaterThan(0);
    await screenshot(page, 'species-page');

    // The same page at phone width: nothing wider than the screen.
    await page.setViewportSize(PHONE);
    await page.getByRole('heading', { name: '2-Methylpropane', level: 1 }).waitFor();
    await expect(sidewaysOverflow(page)).resolves.toBeLessThanOrEqual(0);
    await screenshot(page, 'species-page-phone');

    expect(s.problems).toEqual([]);
  });

  it('shows each row’s phase and value at phone width without scrolling sideways', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize(PHONE);
    await page.goto(`${baseUrl}/browse`);
    const table = page.getByRole('table', { name: 'Species' });
    await table.getByRole('row').nth(1).waitFor();
    await expect(
      table
        .getByRole('columnheader')
        .allTextContents()
        .then((h) => h.map((x) => x.trim())),
    ).resolves.toEqual(['Name', 'Phase', 'ΔfH° (kJ/mol)', '±']);
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    // The value's cell lies inside the screen, not in a part scrolled out of view.
    const value = await table.getByRole('row').nth(1).getByRole('cell').nth(2).boundingBox();
    expect(value!.x + value!.width).toBeLessThanOrEqual(PHONE.width);
    await screenshot(page, 'browse-phone');
    expect(s.problems).toEqual([]);
  });
});
