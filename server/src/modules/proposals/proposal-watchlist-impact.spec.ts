import type { ProposalItemRow } from '../../../../schema';
import {
  buildSnapshot,
  entryId,
  type SnapshotInput,
  type SnapshotSource,
} from '../releases/release-snapshot';
import { overlaid } from './proposal-watchlist-impact';

// Test data only: the numbers exercise the overlay, not any real substance.
const src: SnapshotSource = { id: '1', citation: 'Kestrel test data', doi: null };
const shomate = (tMax: number) => ({
  kind: 'shomate' as const,
  ranges: [{ tMin: 250, tMax, A: 30, B: 6.8, C: 6.8, D: -2.5, E: 0.08 }],
});
const base = buildSnapshot({
  version: 'accepted',
  publishedAt: null,
  species: [{ key: 'water', name: 'water', formula: 'H2O', charge: 0, synonyms: [] }],
  formationValues: [
    {
      revisionId: '1',
      speciesKey: 'water',
      phase: 'l',
      modification: null,
      value: '-285830',
      uncertainty: '40',
      uncertaintyBasis: 'standard',
      method: 'evaluated',
      standardPressure: '1 bar',
      source: src,
    },
  ],
  heatCapacitySets: [
    {
      revisionId: '2',
      speciesKey: 'water',
      phase: 'g',
      modification: null,
      model: shomate(1700),
      source: src,
    },
    {
      revisionId: '3',
      speciesKey: 'water',
      phase: 'l',
      modification: null,
      model: shomate(373.15),
      source: src,
    },
  ],
  transitions: [
    {
      revisionId: '4',
      speciesKey: 'water',
      fromPhase: 'l',
      fromModification: null,
      toPhase: 'g',
      toModification: null,
      temperature: '373.15',
      deltaH: '40656.1',
      source: src,
    },
  ],
} satisfies SnapshotInput);

let seq = 0;
const item = (over: Partial<ProposalItemRow>): ProposalItemRow => ({
  id: ++seq,
  proposalId: 7,
  seq,
  kind: 'supersede_value',
  input: {},
  speciesKey: 'water',
  phase: 'g',
  modification: null,
  quantity: null,
  value: null,
  uncertainty: null,
  sourceId: 1,
  targetRevisionId: null,
  createdRevisionId: null,
  derivation: null,
  inputRevisionIds: [],
  ...over,
});

const at = (snap: ReturnType<typeof overlaid>, phase: string) =>
  snap.entries.get(entryId('water', phase, null))!;

describe('a proposal overlaid on the accepted values', () => {
  it('keeps the heat-capacity sets and transitions it does not touch', () => {
    const snap = overlaid(base, 7, []);
    expect(snap.counts).toMatchObject({ formationValues: 1, heatCapacitySets: 2, transitions: 1 });
    expect(at(snap, 'g').heatCapacity).toBe(at(base, 'g').heatCapacity);
    const [boiling] = at(snap, 'l').transitionsUp;
    expect(boiling).toMatchObject({ revisionId: '4', temperature: 373.15, deltaH: 40656.1 });
    expect(boiling!.to).toBe(at(snap, 'g'));
  });

  it("puts its heat-capacity set in place of the target's and drops a retired transition", () => {
    const ranges = [{ tMin: 298, tMax: 400, coefficients: [30, 6.8, 6.8, -2.5, 0.08] }];
    const snap = overlaid(base, 7, [
      item({
        quantity: 'heat_capacity',
        targetRevisionId: 2,
        input: { kind: 'supersede_value', quantity: 'heat_capacity', form: 'shomate', ranges },
      }),
      item({
        kind: 'retire_value',
        phase: 'l',
        quantity: 'transition:g',
        targetRevisionId: 4,
        input: { kind: 'retire_value', revisionId: 4, sourceId: '1' },
      }),
    ]);
    expect(at(snap, 'g').heatCapacity).toMatchObject({
      revisionId: `proposal-7#${seq - 1}`,
      model: { kind: 'shomate', ranges: [{ tMin: 298, tMax: 400, A: 30 }] },
    });
    expect(at(snap, 'l').heatCapacity?.revisionId).toBe('3');
    expect(snap.counts.transitions).toBe(0);
  });

  it('replaces a transition of the same phases with its own', () => {
    const snap = overlaid(base, 7, [
      item({
        kind: 'supersede_value',
        phase: 'l',
        quantity: 'transition:g',
        value: '44000',
        targetRevisionId: 4,
        input: {
          kind: 'supersede_value',
          quantity: 'transition',
          toPhase: 'g',
          temperature: 372,
          value: 44,
          unit: 'kJ/mol',
        },
      }),
    ]);
    expect(at(snap, 'l').transitionsUp).toHaveLength(1);
    expect(at(snap, 'l').transitionsUp[0]).toMatchObject({ temperature: 372, deltaH: 44000 });
  });
});
