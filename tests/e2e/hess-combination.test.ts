import { openBrowser, screenshot, type BrowserSession } from '../support/browser';

describe('Calculate → Hess combination in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('checks equations as they are typed and combines the steps into the target', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Calculate' })
      .click();
    await page.waitForURL(/\/calculate\/hess/);
    await page.getByRole('heading', { name: 'Hess combination' }).waitFor();
    await expect(
      page.getByRole('note', { name: 'Safety caution' }).textContent(),
    ).resolves.toContain('Hazard assessment of real processes needs measured data');

    // The live check answers from the server for the prefilled example…
    await page.locator('.check[data-check="balanced"]').first().waitFor();

    // …and follows typing: an unbalanced step is flagged with a suggestion, a broken one with its position.
    const step1 = page.getByRole('textbox', { name: 'Step 1 equation' });
    await step1.fill('CH4(g) + O2(g) -> CO2(g) + H2O(g)');
    await page.locator('.check[data-check="unbalanced"]').first().waitFor();
    await expect(
      page.locator('.check[data-check="unbalanced"]').first().textContent(),
    ).resolves.toContain('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)');
    await step1.fill('CH4(g) + 2 O2(g) CO2(g)');
    await page.locator('.check[data-check="invalid"]').first().waitFor();
    await expect(
      page.locator('.check[data-check="invalid"]').first().textContent(),
    ).resolves.toMatch(/position \d+/);
    await step1.fill('CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)');
    await page.locator('.check[data-check="invalid"]').waitFor({ state: 'detached' });

    // Rows can be added and removed: a fifth step appears empty, and removing it restores four.
    await page.getByRole('button', { name: 'Add step' }).click();
    await page.getByRole('textbox', { name: 'Step 5 equation' }).waitFor();
    await page.getByRole('button', { name: 'Remove step 5' }).click();
    await page.getByRole('textbox', { name: 'Step 5 equation' }).waitFor({ state: 'detached' });

    await page.getByRole('button', { name: 'Calculate' }).click();
    await page.getByRole('heading', { name: 'Result' }).waitFor();
    // −802.3 + 283.0 + 3 × 241.8 = 206.1 kJ/mol; the condensation step is not needed.
    await expect(page.locator('.total-value').textContent()).resolves.toMatch(/206\.1/);
    const table = page.getByRole('table', { name: 'Steps as used' });
    await expect(table.textContent()).resolves.toMatch(/×3/);
    await expect(page.getByText(/Step 4: H2O\(g\) -> H2O\(l\)/).count()).resolves.toBe(1);
    await screenshot(page, 'hess-combination');

    // A target that the steps cannot reach is explained in plain words.
    await page.getByRole('textbox', { name: 'Target equation' }).fill('C2H6(g) -> C2H4(g) + H2(g)');
    await page.getByRole('button', { name: 'Calculate' }).click();
    await page.getByText('These steps cannot be combined into the target equation.').waitFor();
    expect(s.problems).toEqual([]);
  });
});
