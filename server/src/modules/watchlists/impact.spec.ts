import path from 'node:path';
import { readDataset } from '../../../../imports/registry-csv';
import { buildSnapshot } from '../releases/release-snapshot';
import { createReactionsService } from '../reactions/reactions-service';
import { datasetSnapshotInput, starterSnapshot } from '../reactions/testing/starter-snapshot';
import { impactReport } from './impact';

// Release 2026.1 is the starter data; "2026.2" is the same with carbon dioxide's ΔfH° raised by
// 1 kJ/mol, so every reaction's change is its CO2 coefficient in kJ/mol.
function revisedSnapshot() {
  const input = datasetSnapshotInput(
    readDataset(path.resolve(__dirname, '../../../../imports/starter')),
    '2026.2',
  );
  const formationValues = input.formationValues.map((f) =>
    f.speciesKey === 'carbon-dioxide' && f.phase === 'g'
      ? { ...f, value: String(Number(f.value) + 1000) }
      : f,
  );
  return buildSnapshot({ ...input, formationValues });
}

describe('impactReport', () => {
  const reactions = createReactionsService(async () => null);
  const from = starterSnapshot();
  const to = revisedSnapshot();

  it('changes ΔrH by exactly the coefficient times the value change', () => {
    const report = impactReport(reactions, from, to, {
      unit: 'J/mol',
      reactions: [
        { equation: 'C3H8(g) + 5 O2(g) -> 3 CO2(g) + 4 H2O(l)', label: 'propane' },
        { equation: 'CaCO3(calcite) -> CaO(cr) + CO2(g)' },
        { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)' },
      ],
    });
    expect(report).toMatchObject({ from: '2026.1', to: '2026.2', count: 3, errors: 0 });
    expect(report.results.map((r) => r.change)).toEqual([3000, 1000, 0]);
    expect(report.results[0]!.label).toBe('propane');
    expect(report.results[2]!.exceedsUncertainty).toBe(false);
  });

  it('flags a change beyond the combined uncertainty, and gives null where none is stated', () => {
    const report = impactReport(reactions, from, to, {
      unit: 'kJ/mol',
      reactions: [{ equation: 'C(graphite) + O2(g) -> CO2(g)' }],
    });
    const [item] = report.results;
    // CO2(g): ±0.13 kJ/mol in both (CODATA Key Values, expanded): √2 × 0.13 < 1.
    expect(item!.change).toBe(1);
    expect(item!.combinedUncertainty).toBeCloseTo(Math.hypot(0.13, 0.13), 12);
    expect(item!.exceedsUncertainty).toBe(true);
    expect(report.exceeding).toBe(1);
  });

  it('keeps per-item errors of either release and the other items', () => {
    const report = impactReport(reactions, from, to, {
      unit: 'kJ/mol',
      temperatureK: 298.15,
      reactions: [{ equation: 'H2 ->' }, { equation: 'C(graphite) + O2(g) -> CO2(g)' }],
    });
    expect(report.errors).toBe(1);
    const bad = report.results[0]!;
    expect(bad.change).toBeNull();
    expect('error' in bad.from && bad.from.error.code).toBe('parse_error');
    expect(report.results[1]!.change).toBe(1);
  });
});
