import type { Locator, Page } from 'playwright-core';

import {
  openBrowser,
  PHONE,
  screenshot,
  sidewaysOverflow,
  type BrowserSession,
} from '../support/browser';

const EQUATION = 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)';

/** The number in a result such as "−802.56 ± 0.4 kJ/mol" (either minus sign). */
async function totalOf(page: Page): Promise<number> {
  const text = (await page.locator('.total-value').textContent()) ?? '';
  return Number(text.replace('\u2212', '-').split(/\s/)[0]);
}

/** Every term row names where its number comes from: a revision and a citation, or the reference-state rule. */
async function expectProvenanceOnEveryTerm(terms: Locator): Promise<void> {
  const rows = terms.locator('tbody tr');
  const count = await rows.count();
  expect(count).toBe(4);
  for (let i = 0; i < count; i++) {
    const text = (await rows.nth(i).locator('.provenance').textContent()) ?? '';
    expect(text).toMatch(/Revision \d+|reference state/i);
    expect(text.trim().length).toBeGreaterThan(20);
  }
}

describe('Calculate → Reaction enthalpy in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s?.close());

  it('computes a fuel-gas combustion against release 2026.1 at 298.15 K and 800 K with the provenance of each term', async () => {
    const { page, baseUrl } = s;
    await page.goto(baseUrl);
    await page
      .getByRole('navigation', { name: 'Main' })
      .getByRole('link', { name: 'Calculate' })
      .click();
    await page
      .getByRole('navigation', { name: 'Calculate' })
      .getByRole('tab', { name: 'Reaction enthalpy' })
      .click();
    await page.waitForURL(/\/calculate\/reaction/);
    await page.getByRole('heading', { name: 'Reaction enthalpy', level: 1 }).waitFor();
    await expect(
      page.getByRole('note', { name: 'Safety caution' }).textContent(),
    ).resolves.toContain('Hazard assessment of real processes needs measured data');

    await page.getByRole('textbox', { name: 'Equation' }).fill(EQUATION);
    await page.locator('.check[data-check="balanced"]').waitFor();
    await page.getByRole('combobox', { name: 'Release' }).click();
    await page.getByRole('option', { name: '2026.1', exact: true }).click();
    await page.getByRole('textbox', { name: 'Temperature in kelvin' }).fill('298.15');
    await page.getByRole('button', { name: 'Calculate', exact: true }).click();

    // The calculation is in the address, so the link reproduces it.
    await page.waitForURL((url) => url.searchParams.get('release') === '2026.1');
    const url = new URL(page.url());
    expect(url.searchParams.get('equation')).toBe(EQUATION);
    expect(url.searchParams.get('temperatureK')).toBe('298.15');

    await page.getByRole('heading', { name: 'ΔrH° at 298.15 K' }).waitFor();
    // −393.51 − 2 × 241.826 + 74.6 ≈ −802.6 kJ/mol (CODATA key values; CH4 from the NBS tables).
    const at298 = await totalOf(page);
    expect(at298).toBeGreaterThan(-803.5);
    expect(at298).toBeLessThan(-801.5);
    await expect(page.locator('.character').textContent()).resolves.toBe('exothermic');
    const terms = page.getByRole('table', { name: 'Terms of the reaction' });
    await expectProvenanceOnEveryTerm(terms);
    await expect(terms.getByRole('link', { name: 'CH₄' }).getAttribute('href')).resolves.toBe(
      '/species/methane?release=2026.1',
    );
    await page.locator('thalpos-reaction-curve canvas').waitFor();
    await screenshot(page, 'reaction-enthalpy-298');

    // Changing an input hides the result until it is computed again.
    const temperature = page.getByRole('textbox', { name: 'Temperature in kelvin' });
    await temperature.fill('800');
    await page.getByText('The inputs have changed since the last calculation.').waitFor();
    await expect(page.locator('thalpos-reaction-result').count()).resolves.toBe(0);
    await page.getByRole('button', { name: 'Calculate', exact: true }).click();

    await page.getByRole('heading', { name: 'ΔrH° at 800 K' }).waitFor();
    expect(new URL(page.url()).searchParams.get('temperatureK')).toBe('800');
    const at800 = await totalOf(page);
    // Kirchhoff's law moves ΔrH by a few kJ/mol over 298–800 K for this reaction.
    expect(at800).not.toBe(at298);
    expect(Math.abs(at800 - at298)).toBeLessThan(5);
    await expect(
      terms.getByRole('columnheader', { name: /H\(T\) − H\(298\.15 K\)/ }).count(),
    ).resolves.toBe(1);
    await expectProvenanceOnEveryTerm(terms);
    await expect(terms.locator('.provenance').first().textContent()).resolves.toMatch(
      /Heat capacity: revision/,
    );
    await expect(page.getByText('At 298.15 K:').count()).resolves.toBe(1);
    await page.locator('thalpos-reaction-curve canvas').waitFor();
    await screenshot(page, 'reaction-enthalpy-800');

    // Opening the link anew gives the same answer.
    await page.goto(page.url());
    await page.getByRole('heading', { name: 'ΔrH° at 800 K' }).waitFor();
    await expect(totalOf(page)).resolves.toBe(at800);

    // At phone width the screen fits: each term becomes a card of its own.
    await page.setViewportSize(PHONE);
    await page.getByRole('heading', { name: 'ΔrH° at 800 K' }).waitFor();
    await expect(sidewaysOverflow(page)).resolves.toBeLessThanOrEqual(0);
    await expect(page.locator('.terms tr.mat-mdc-header-row').isVisible()).resolves.toBe(false);
    await screenshot(page, 'reaction-enthalpy-phone');

    expect(s.problems).toEqual([]);
  });
});
