import { phaseName, PHASES } from './equation-types';

describe('phaseName', () => {
  it('spells every phase out, with the modification after a comma', () => {
    expect(PHASES.map((p) => phaseName(p))).toEqual([
      'gas',
      'liquid',
      'crystal',
      'solid',
      'amorphous',
      'aqueous',
    ]);
    expect(phaseName('cr', 'diamond')).toBe('crystal, diamond');
    expect(phaseName(null)).toBeNull();
  });
});
