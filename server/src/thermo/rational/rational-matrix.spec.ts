import Fraction from 'fraction.js';
import { nullSpace, rref, solveLinear } from './rational-matrix';

const F = (rows: (number | string)[][]): Fraction[][] =>
  rows.map((r) => r.map((x) => new Fraction(x)));
const text = (v: readonly Fraction[]): string[] => v.map((x) => x.toFraction());

describe('exact linear algebra', () => {
  it('reduces to row echelon form with exact fractions', () => {
    const { matrix, pivots } = rref(
      F([
        [2, 4, 2],
        [1, 3, 2],
        [3, 7, 4],
      ]),
    );
    expect(pivots).toEqual([0, 1]);
    expect(matrix.map(text)).toEqual([
      ['1', '0', '-1'],
      ['0', '1', '1'],
      ['0', '0', '0'],
    ]);
  });

  it('keeps thirds exact where floating point would not', () => {
    const { matrix } = rref(
      F([
        [3, 1],
        [1, 2],
      ]),
    );
    expect(matrix.map(text)).toEqual([
      ['1', '0'],
      ['0', '1'],
    ]);
    const [v] = nullSpace(
      F([
        [3, -1, 0],
        [0, 1, -3],
      ]),
      3,
    );
    expect(text(v as Fraction[])).toEqual(['1', '3', '1']);
    const [w] = nullSpace(
      F([
        [3, 0, -1],
        [0, 3, -2],
      ]),
      3,
    );
    expect(text(w as Fraction[])).toEqual(['1/3', '2/3', '1']);
  });

  it('finds the null space of a composition matrix: CH4 + O2 -> CO2 + H2O', () => {
    // rows C, H, O; reactant columns positive, product columns negative
    const basis = nullSpace(
      F([
        [1, 0, -1, 0],
        [4, 0, 0, -2],
        [0, 2, -2, -1],
      ]),
      4,
    );
    expect(basis).toHaveLength(1);
    expect(text(basis[0] as Fraction[])).toEqual(['1/2', '1', '1/2', '1']);
  });

  it('solves consistent systems and returns the null space', () => {
    const s = solveLinear(
      F([
        [1, 1],
        [0, 1],
      ]),
      F([[3], [1]]).map((r) => r[0] as Fraction),
      2,
    );
    expect(s.consistent).toBe(true);
    if (s.consistent) {
      expect(text(s.particular)).toEqual(['2', '1']);
      expect(s.nullSpace).toHaveLength(0);
    }
    const free = solveLinear(F([[1, 1]]), [new Fraction(2)], 2);
    expect(free.consistent && text(free.particular)).toEqual(['2', '0']);
    expect(free.consistent && free.nullSpace.map(text)).toEqual([['-1', '1']]);
  });

  it('certifies inconsistency with a combination of rows', () => {
    const a = F([
      [1, 0],
      [0, 1],
      [1, 1],
    ]);
    const b = F([[1], [1], [3]]).map((r) => r[0] as Fraction);
    const s = solveLinear(a, b, 2);
    expect(s.consistent).toBe(false);
    if (!s.consistent) {
      const y = s.certificate;
      // yᵀA = 0 and yᵀb ≠ 0
      for (let j = 0; j < 2; j++)
        expect(
          a
            .reduce(
              (acc, row, i) => acc.add((y[i] as Fraction).mul(row[j] as Fraction)),
              new Fraction(0),
            )
            .valueOf(),
        ).toBe(0);
      expect(
        b.reduce((acc, x, i) => acc.add((y[i] as Fraction).mul(x)), new Fraction(0)).valueOf(),
      ).not.toBe(0);
    }
  });
});
