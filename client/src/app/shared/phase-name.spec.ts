import { phaseLabel, phaseName } from './phase-name';

describe('phase words', () => {
  it('spells phases out for tables, with the modification after a comma', () => {
    expect(phaseName('g')).toBe('gas');
    expect(phaseName('aq')).toBe('aqueous');
    expect(phaseName('cr', 'diamond')).toBe('crystal, diamond');
    expect(phaseName(null, 'calcite')).toBe('crystal, calcite');
    expect(phaseName(null)).toBe('not stated');
  });

  it('writes a polymorph by its own name after the formula, the default as plain (cr)', () => {
    expect(phaseLabel('cr', 'diamond')).toBe('(diamond)');
    expect(phaseLabel('cr', null)).toBe('(cr)');
    expect(phaseLabel('l')).toBe('(l)');
  });
});
