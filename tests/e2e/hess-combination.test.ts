import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

// Every wait below waits for something on the page, never for a fixed time: a slow machine makes
// the run slower, not red (the e2e project has a generous test timeout in jest.config.js).
describe('Calculate → Hess combination in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  const field = (name: string) => s.page.getByRole('textbox', { name, exact: true });
  const hintOf = (name: string) =>
    s.page.locator('thalpos-equation-field', { has: field(name) }).locator('.check');
  const checkOf = (name: string, state: string) =>
    s.page
      .locator('thalpos-equation-field', { has: field(name) })
      .locator(`.check[data-check="${state}"]`);

  it('reads typed numbers faithfully, points at errors, and ties the result to its inputs (1366×900)', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Calculate' })
      .click();
    await page.waitForURL(/\/calculate\//);
    await page
      .getByRole('navigation', { name: 'Calculate' })
      .getByRole('tab', { name: 'Hess combination' })
      .click();
    await page.getByRole('heading', { name: 'Hess combination' }).waitFor();
    await expect(
      page.getByRole('note', { name: 'Safety caution' }).textContent(),
    ).resolves.toContain('Hazard assessment of real processes needs measured data');

    // The Kestrel fuel-gas example is checked live and read back with real subscripts.
    await checkOf('Step 4 equation', 'balanced').filter({ hasText: 'H₂O(l) → H₂O(g)' }).waitFor();

    // A typographic minus and a decimal comma keep their sign and size.
    await field('Step 2 ΔH').fill('\u2212282,98');
    await field('Step 1 ΔH').fill('\u201335.66');
    // A thousands separator is refused with a message, never read as another number.
    await field('Step 3 ΔH').fill('-285,830');
    await page.getByText('-285,830 is ambiguous').first().waitFor();
    await field('Step 3 ΔH').fill('-285.83');

    // Parse errors point at the character, 1-based, in the field that has them.
    await field('Step 1 equation').fill('CH4(g) + 1/2 O2(g) CO(g) + 2 H2(g)');
    const step1 = hintOf('Step 1 equation');
    await step1.locator('mark').waitFor();
    await expect(step1.textContent()).resolves.toMatch(/at character \d+/);
    await field('Step 1 equation').fill('Xy2(g) -> Xy2(l)');
    await step1.getByText(/unknown element symbol '?Xy/).waitFor();
    await field('Step 1 equation').fill('CH4(G) + 1/2 O2(g) -> CO(g) + 2 H2(g)');
    await step1.getByText('phases are written in lower case: (g), not (G)').waitFor();
    // A term without a phase is named, and Calculate refuses it.
    await field('Step 1 equation').fill('CH4 + 1/2 O2(g) -> CO(g) + 2 H2(g)');
    await checkOf('Step 1 equation', 'invalid')
      .filter({ hasText: 'Every term needs its phase on this screen: CH4 has none' })
      .waitFor();
    await page.getByRole('button', { name: 'Calculate' }).click();
    await page.getByText('Step 1 equation: CH4 needs a phase').waitFor();
    await field('Step 1 equation').fill('CH4(g) + 1/2 O2(g) -> CO(g) + 2 H2(g)');
    await checkOf('Step 1 equation', 'balanced').waitFor();

    await page.getByRole('button', { name: 'Calculate' }).click();
    await page.getByRole('heading', { name: 'Result' }).waitFor();
    // −35.66 − 282.98 + 2 × (−285.83) + 2 × 44.00 = −802.30 kJ/mol; step 5 is not needed.
    await expect(page.locator('.total').textContent()).resolves.toMatch(
      /ΔrH°\(298\.15 K\) = \u2212802\.30 kJ\/mol/,
    );
    await page.getByText('Exothermic: heat is released').waitFor();
    await page.getByText('Uncertainty not combined: step 1 has none.').waitFor();
    const table = page.getByRole('table', { name: 'Steps as used' });
    await expect(table.textContent()).resolves.toContain('2 × (H₂(g) + 1/2 O₂(g) → H₂O(l))');
    await page.getByText('Step 5: N₂(g) + O₂(g) → 2 NO(g)').waitFor();
    const link = await page.locator('a.permalink').getAttribute('href');
    await screenshot(page, 'hess-combination-desktop');

    // Editing marks the result out of date; Clear removes it.
    await field('Step 2 ΔH').fill('-283.5');
    await page.getByText(/Out of date: the inputs changed/).waitFor();
    await page.getByRole('button', { name: 'Clear' }).click();
    await expect(field('Target equation').inputValue()).resolves.toBe('');
    await page.getByRole('heading', { name: 'Result' }).waitFor({ state: 'detached' });

    // Keyboard focus is clearly outlined, also on the filled Calculate button.
    await page.getByRole('button', { name: 'Clear' }).focus();
    await page.keyboard.press('Tab');
    await expect(
      page.evaluate<string>(
        `(() => { const e = document.activeElement, s = getComputedStyle(e);
          return [e.textContent.trim(), s.outlineStyle, s.outlineWidth].join('|'); })()`,
      ),
    ).resolves.toMatch(/Calculate\|solid\|3px/);

    // The link reproduces the calculation from the URL alone.
    await page.goto(link!);
    await page.getByRole('heading', { name: 'Result' }).waitFor();
    await expect(page.locator('.total-value').textContent()).resolves.toContain('\u2212802.30');

    // Unknown addresses say so instead of going home.
    await page.goto(`${baseUrl}/calculate/hes`);
    await page.getByRole('heading', { name: 'Page not found' }).waitFor();
    expect(s.problems).toEqual([]);
  });

  it('fits a phone (390×844) and signing in comes back with the inputs intact', async () => {
    const { page, baseUrl } = s;
    await page.setViewportSize(PHONE);
    await page.goto(`${baseUrl}/calculate/hess`);
    await field('Step 3 ΔH').fill('-285.830');
    await page.waitForURL(/step=.*-285\.830/);
    await page.getByRole('button', { name: 'Calculate' }).click();
    await page.getByRole('heading', { name: 'Result' }).waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    // The header scrolls away with the page at phone width.
    await expect(
      page.evaluate("getComputedStyle(document.querySelector('.top-bar')).position"),
    ).resolves.toBe('static');
    await screenshot(page, 'hess-combination-phone');

    await page
      .getByRole('link', { name: /sign in/i })
      .first()
      .click();
    await page.waitForURL(/\/login\/oauth\/authorize/);
    await page.getByRole('link', { name: /demo-reader/ }).click();
    await page.waitForURL(/\/calculate\/hess\?/);
    await expect(field('Step 3 ΔH').inputValue()).resolves.toBe('-285.830');
    await page.getByRole('heading', { name: 'Result' }).waitFor();
    expect(s.problems).toEqual([]);
  });
});
