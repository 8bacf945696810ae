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

describe('four eyes: an editor cannot decide their own proposal', () => {
  let s: BrowserSession;
  beforeAll(async () => {
    s = await openBrowser(PHONE);
  });
  afterAll(() => s.close());

  const status = async (id: number) =>
    (await s.t.db.pool.query(`select status from proposals where id = $1`, [id])).rows[0].status;

  it('proposes at phone width, is refused its own approval, and revises after changes are asked for', async () => {
    const { page, baseUrl } = s;

    // --- a second editor proposes, on a phone ---
    await signInTo(s, 'demo-editor-2', '/curation/propose');
    await startReplacingValue(page, 'Propane re-evaluated by the demo team (demo data).', {
      species: 'propane',
      option: /Propane/,
      phase: 'gas',
    });
    await page.getByRole('combobox', { name: 'Unit' }).click();
    await page.getByRole('option', { name: 'kcal/mol' }).click();
    await page.getByLabel('Item 1 value').fill('-25.02');
    await page.getByText('Stored as −104683.68 J/mol').waitFor();
    await page.getByLabel('Method').fill('evaluated');

    // An existing source, found by searching the registered ones.
    await page.getByLabel('Item 1 source').fill('Chase');
    await page.getByRole('option', { name: /Chase/ }).first().click();
    await page.getByRole('group', { name: 'Item 1 source' }).getByText(/Chase/).waitFor();

    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'curation-propose-phone');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.waitForURL(/\/curation\/proposals\/\d+$/);
    const id = Number(/(\d+)$/.exec(page.url())?.[1]);
    await page.getByText('Waiting for review').first().waitFor();

    // --- the same editor tries to approve it and is told why not ---
    await page.getByText('You proposed this; another editor has to decide it.').waitFor();
    await page.getByRole('radio', { name: 'Approve' }).check();
    await page.getByLabel('Comment for the proposer').fill('Approving my own work.');
    await page.getByRole('button', { name: 'Approve', exact: true }).click();
    const refusal = page.getByRole('alert').filter({ hasText: 'cannot decide your own proposal' });
    await refusal.waitFor();
    await refusal.getByText(/another editor/i).waitFor();
    expect(await sidewaysOverflow(page)).toBeLessThanOrEqual(0);
    await screenshot(page, 'curation-own-proposal-refused-phone');
    expect(await status(id)).toBe('submitted');

    // --- another editor asks for changes ---
    await page.setViewportSize(DESKTOP);
    await signInTo(s, 'demo-editor', `/curation/proposals/${id}`);
    await page.getByRole('radio', { name: 'Ask for changes' }).check();
    await page.getByLabel('Comment for the proposer').fill('Please state the uncertainty.');
    await page.getByRole('button', { name: 'Ask for changes', exact: true }).click();
    await page.getByText('Decision saved: Changes asked for.').waitFor();
    expect(await status(id)).toBe('changes_requested');

    // --- the proposer revises from their list, seeing the editor's comment ---
    await signInTo(s, 'demo-editor-2', '/curation/proposals');
    await page.getByRole('heading', { name: 'My proposals' }).waitFor();
    const card = page.getByRole('listitem').filter({ hasText: `#${id}` });
    await card.getByText('Changes asked for').waitFor();
    await card.getByRole('link', { name: 'Revise' }).click();
    await page.waitForURL(`${baseUrl}/curation/proposals/${id}/edit`);
    await page
      .getByRole('region', { name: 'What the editors said' })
      .getByText('Please state the uncertainty.')
      .waitFor();
    // The draft comes back as typed: kcal/mol and the value entered.
    await expect(page.getByLabel('Item 1 value').inputValue()).resolves.toBe('-25.02');
    await page.getByLabel('Item 1 uncertainty').fill('0.12');
    await screenshot(page, 'curation-revise');
    await page.getByRole('button', { name: 'Send again for review' }).click();
    await page.waitForURL(`${baseUrl}/curation/proposals/${id}`);
    await page.getByText('Waiting for review').first().waitFor();
    expect(await status(id)).toBe('submitted');
    expect(s.problems).toEqual([]);
  });
});
