import { openBrowser, screenshot, signInTo, type BrowserSession } from '../support/browser';

// The fake DOI service's demo record (10.5555 is a prefix set aside for examples; demo data).
const DEMO_DOI = '10.5555/kestrel.demo.2025.001';

describe('sources', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(() => s.close());

  it('a curator finds a starter source, then adds one by DOI and attaches a PDF to it', async () => {
    const { page } = s;
    await signInTo(s, 'demo-curator', '/sources');
    await page.getByRole('heading', { name: 'Sources' }).waitFor();

    await page.getByLabel('Search sources').fill('CODATA');
    await page.getByRole('link', { name: /CODATA Key Values for Thermodynamics/ }).click();
    await page.getByText('Cox, J. D., Wagman, D. D., & Medvedev, V. A. (1989).').waitFor();
    const bib = await page.getByRole('link', { name: 'BibTeX' }).getAttribute('href');
    expect(bib).toMatch(/^\/api\/v1\/sources\/\d+\.bib$/);
    await screenshot(page, 'source-page');

    await page.getByRole('link', { name: 'All sources' }).click();
    await page.getByRole('button', { name: 'Add source' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByRole('textbox', { name: 'DOI' }).fill(DEMO_DOI);
    await dialog.getByRole('button', { name: 'Add source' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.getByText(/Bomb calorimetry of plant-grade methanol \(demo data\)/).waitFor();
    await page.getByRole('link', { name: DEMO_DOI }).waitFor();

    await page.locator('thalpos-document-upload input[type=file]').setInputFiles({
      name: 'methanol-run.pdf',
      mimeType: 'application/pdf',
      buffer: Buffer.from('%PDF-1.4\n1 0 obj <</Type /Catalog>> endobj\ntrailer <<>>\n%%EOF\n'),
    });
    await page.getByText('methanol-run.pdf attached.').waitFor();
    await page.getByRole('link', { name: 'methanol-run.pdf' }).waitFor();
    await screenshot(page, 'source-with-document');
  });
});
