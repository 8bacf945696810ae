import {
  buildSnapshot,
  candidatesOf,
  entryId,
  formulaKey,
  type SnapshotInput,
  type SnapshotSource,
} from './release-snapshot';

// A tiny release of the Kestrel Process Works data team; the numbers only exercise indexing.
const src: SnapshotSource = { id: 's1', citation: 'Kestrel test data', doi: null };
const input: SnapshotInput = {
  version: '2026.1',
  publishedAt: '2026-01-01T00:00:00.000Z',
  species: [
    { key: 'water', name: 'water', formula: 'H2O', charge: 0, synonyms: [] },
    { key: 'butane', name: 'butane', formula: 'C4H10', charge: 0, synonyms: ['n-butane'] },
    { key: '2-methylpropane', name: '2-methylpropane', formula: 'C4H10', charge: 0, synonyms: [] },
    { key: 'sulfate', name: 'sulfate ion', formula: 'O4S', charge: -2, synonyms: [] },
  ],
  formationValues: [
    {
      revisionId: 'r1',
      speciesKey: 'water',
      phase: 'l',
      modification: null,
      value: '-285830',
      uncertainty: '40',
      uncertaintyBasis: 'standard',
      method: 'combustion calorimetry',
      standardPressure: '1 bar',
      source: src,
    },
    {
      revisionId: 'r2',
      speciesKey: 'water',
      phase: 'g',
      modification: null,
      value: '-241826',
      uncertainty: null,
      uncertaintyBasis: null,
      method: 'derived',
      standardPressure: '1 bar',
      source: src,
    },
  ],
  heatCapacitySets: [
    {
      revisionId: 'r3',
      speciesKey: 'water',
      phase: 'g',
      modification: null,
      model: {
        kind: 'shomate',
        ranges: [{ tMin: 298, tMax: 1700, A: 30, B: 6.8, C: 6.8, D: -2.5, E: 0.08 }],
      },
      source: src,
    },
  ],
  transitions: [
    {
      revisionId: 'r4',
      speciesKey: 'water',
      fromPhase: 'l',
      fromModification: null,
      toPhase: 'g',
      toModification: null,
      temperature: '373.15',
      deltaH: '40650',
      source: src,
    },
  ],
};

describe('buildSnapshot', () => {
  const snap = buildSnapshot(input);

  it('indexes species-phases with their values as numbers', () => {
    const liquid = snap.entries.get(entryId('water', 'l', null));
    expect(liquid?.formation?.joules).toBe(-285830);
    expect(liquid?.formation?.uncertaintyJoules).toBe(40);
    expect(snap.entries.get(entryId('water', 'g', null))?.formation?.uncertaintyJoules).toBeNull();
    expect(snap.counts).toEqual({
      species: 4,
      speciesPhases: 2,
      formationValues: 2,
      heatCapacitySets: 1,
      transitions: 1,
    });
  });

  it('groups isomers under one formula and keeps charges apart', () => {
    expect(snap.speciesByFormula.get('C4H10')?.map((s) => s.key)).toEqual([
      'butane',
      '2-methylpropane',
    ]);
    expect(formulaKey({ formula: 'O4S', charge: -2 })).toBe('O4S^2-');
    expect(snap.speciesByFormula.get('O4S^2-')?.[0]?.key).toBe('sulfate');
  });

  it('links transitions both ways', () => {
    const liquid = snap.entries.get(entryId('water', 'l', null));
    const gas = snap.entries.get(entryId('water', 'g', null));
    expect(liquid?.transitionsUp[0]?.to).toBe(gas);
    expect(gas?.transitionsDown[0]?.from).toBe(liquid);
    expect(liquid?.transitionsUp[0]?.deltaH).toBe(40650);
  });

  it('lists candidates for an unwritten phase', () => {
    expect(candidatesOf(snap, 'water', null, null).map((e) => e.phase)).toEqual(['l', 'g']);
    expect(candidatesOf(snap, 'water', 'g', null)).toHaveLength(1);
    expect(candidatesOf(snap, 'butane', null, null)).toHaveLength(0);
  });

  it('refuses inconsistent rows', () => {
    expect(() => buildSnapshot({ ...input, species: input.species.slice(1) })).toThrow(
      /unknown species water/,
    );
    expect(() =>
      buildSnapshot({
        ...input,
        formationValues: [input.formationValues[0]!, input.formationValues[0]!],
      }),
    ).toThrow(/two ΔfH°/);
    expect(() =>
      buildSnapshot({ ...input, formationValues: [{ ...input.formationValues[0]!, value: 'x' }] }),
    ).toThrow(/not a finite decimal/);
  });
});
