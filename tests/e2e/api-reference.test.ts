import { openBrowser, screenshot, type BrowserSession } from '../support/browser';

describe('API reference page in the browser', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s?.close());

  it('renders the generated reference under the app CSP, with the caution and examples', async () => {
    const { page, baseUrl } = s;
    await page.goto(`${baseUrl}/api/docs`);
    await page.waitForURL(/\/api\/docs\/$/);
    await page.getByRole('heading', { name: /Thalpos API/ }).waitFor();
    await page
      .getByText(/licensed engineering practice/)
      .first()
      .waitFor();

    // One operation opened: its example request body comes from the reference itself.
    const batch = page.locator('#operations-Reaction_enthalpy-postApiV1ReactionEnthalpyBatch');
    await batch.locator('.opblock-summary').click();
    await batch
      .getByText(/"equation": "CO\(g\) \+ H2O\(g\) -> CO2\(g\) \+ H2\(g\)"/)
      .first()
      .waitFor();
    await screenshot(page, 'api-reference');

    // No script blocked, no request refused: the page lives entirely on this site.
    expect(s.problems).toEqual([]);
  });
});
