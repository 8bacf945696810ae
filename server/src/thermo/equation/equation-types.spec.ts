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

  // A fuzzed call found this: an object without a string form as the phase threw a TypeError.
  it('answers null for a phase that is not one of ours, whatever it is', () => {
    for (const junk of [Object.create(null), {}, 'toString', '__proto__', 7, undefined])
      expect(phaseName(junk as never)).toBeNull();
    expect(phaseName('g', Object.create(null) as never)).toBe('gas');
  });
});
