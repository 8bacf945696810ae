import type { WatcherReport } from '../watchlists/watchlist-impacts';
import { releaseImpactMail } from './release-mail';

// The plain-text body of the publish e-mail, from a hand-built impact report (the numbers are
// invented for the layout; the API test checks real ones against the impact endpoint).
const report = (results: WatcherReport['report']['results']): WatcherReport => ({
  owner: { id: 7, login: 'demo-reader', name: 'Tomás Reyes', email: 't@kestrel.example' },
  watchlist: { id: 3, name: 'Boiler feed' },
  report: {
    from: '2026.1',
    to: '2026.2',
    unit: 'kJ/mol',
    watchlistId: 3,
    count: results.length,
    errors: results.filter((r) => r.change === null).length,
    exceeding: results.filter((r) => r.exceedsUncertainty).length,
    results,
    caution: 'Check against local codes.',
  },
});

const side = (deltaH: number, uncertainty: number | null, basis = 'standard') => ({
  equation: 'H2(g) + 1/2 O2(g) -> H2O(l)',
  deltaH,
  uncertainty,
  uncertaintyBasis: basis,
});

describe('releaseImpactMail', () => {
  it('states ΔrH in both releases, the change, and flags a change beyond the combined uncertainty', () => {
    const mail = releaseImpactMail(
      report([
        {
          index: 0,
          label: 'Feed water',
          input: 'H2(g) + 1/2 O2(g) -> H2O(l)',
          temperatureK: 298.15,
          from: side(-285.83, 0.04),
          to: side(-285.5, 0.05, 'expanded_k2'),
          change: 0.33,
          combinedUncertainty: 0.064,
          exceedsUncertainty: true,
        },
      ]),
      'https://thalpos.kestrel.example',
    );
    expect(mail.subject).toBe('Release 2026.2 published — impact on your watchlist “Boiler feed”');
    expect(mail.text).toContain(
      [
        '- Feed water: H2(g) + 1/2 O2(g) -> H2O(l) (at 298.15 K)',
        '  2026.1: ΔrH = −285.83 ± 0.04 (standard uncertainty) kJ/mol',
        '  2026.2: ΔrH = −285.50 ± 0.05 (expanded, k = 2) kJ/mol',
        '  change +0.33 kJ/mol (combined uncertainty 0.06)  ← beyond the combined uncertainty',
      ].join('\n'),
    );
    expect(mail.text).toContain(
      '1 of 1 reactions changed by more than their combined uncertainty.',
    );
    expect(mail.text).toContain('https://thalpos.kestrel.example/releases/2026.1/diff/2026.2');
    expect(mail).toMatchObject({ eventKind: 'release.published', recipientId: 7 });
  });

  it('says which release cannot compute a reaction, and why, with no change line', () => {
    const mail = releaseImpactMail(
      report([
        {
          index: 0,
          label: null,
          input: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
          temperatureK: 298.15,
          from: {
            error: { code: 'unknown_species', message: 'No value for CH4(g).', status: 422 },
          },
          to: side(-890.6, null),
          change: null,
          combinedUncertainty: null,
          exceedsUncertainty: null,
        },
      ]),
      'https://thalpos.kestrel.example',
    );
    expect(mail.text).toContain(
      [
        '- CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l) (at 298.15 K)',
        '  2026.1: cannot be computed: No value for CH4(g).',
        '  2026.2: ΔrH = −890.60 kJ/mol',
      ].join('\n') + '\n\n',
    );
    expect(mail.text).not.toContain('change ');
    expect(mail.text).toContain(
      'None of the 1 reactions changed by more than its combined uncertainty.',
    );
  });
});
