import type { DraftChange } from '@contracts/releases/release-drafts-schemas';

import { ApiError } from '../../../core/api-error';
import { differenceText, publishProblem, quantityLabel, sideText } from './draft-words';

const side = (value: number | null, uncertainty: number | null = null) => ({
  revisionId: 1,
  kind: 'formation_enthalpy' as const,
  value,
  valueText: value === null ? null : String(value),
  uncertainty,
  uncertaintyBasis: uncertainty === null ? null : ('standard' as const),
  method: null,
  temperature: null,
  heatCapacityForm: null,
  source: { id: 1, citation: 'Demo source', doi: null },
});

describe('publishProblem', () => {
  const err = (code: string, details: Record<string, unknown> = {}) =>
    new ApiError(409, code, `server says ${code}`, details);

  it.each([
    ['already_published', /already published/],
    ['publish_in_progress', /publishing this release right now/],
    ['empty_release', /changes nothing/],
  ])('explains %s', (code, words) => {
    expect(publishProblem(err(code))).toMatch(words);
  });

  it('names both releases of a stale draft', () => {
    expect(publishProblem(err('stale_draft', { base: '2026.1', latest: '2026.2' }))).toBe(
      'Release 2026.2 was published after this draft was started from 2026.1. Move the draft onto 2026.2 and check its changes again.',
    );
  });

  it('counts stale derived values and a taken version', () => {
    expect(publishProblem(err('stale_derived', { revisionIds: [4, 5] }))).toMatch(
      /^2 derived values would be published stale/,
    );
    expect(publishProblem(err('version_taken', { version: '2026.2' }))).toBe(
      'Release 2026.2 already exists: choose another version.',
    );
  });

  it('keeps the server message for other codes', () => {
    expect(publishProblem(err('something_else'))).toBe('server says something_else');
  });
});

describe('change words', () => {
  it('writes values in kJ/mol with real minus signs', () => {
    expect(sideText(side(-285830, 40))).toBe('−285.83 ± 0.04 kJ/mol');
    expect(sideText(null)).toBe('—');
  });

  it('writes the difference in kJ/mol and in combined uncertainties', () => {
    const change = {
      difference: { kJPerMol: 0.07, combinedUncertainties: -1.25 },
    } as DraftChange;
    expect(differenceText(change)).toBe('+0.07 kJ/mol (−1.3 u)');
    expect(differenceText({ difference: null } as DraftChange)).toBe('—');
  });

  it('names quantities in trade words', () => {
    expect(quantityLabel('formation_enthalpy')).toBe('ΔfH°');
    expect(quantityLabel('transition:l')).toBe('Transition to liquid');
  });
});
