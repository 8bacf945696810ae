import type Fraction from 'fraction.js';
import { isZero, ONE, ZERO } from './rational';

/**
 * Exact linear algebra over the rationals (Gauss–Jordan elimination with fraction.js). The
 * matrices here are small (species × reactions), so clarity beats cleverness; exactness is the
 * point: a null space is a null space, not a tolerance.
 */
export type Matrix = Fraction[][];

export interface Rref {
  readonly matrix: Matrix;
  /** Pivot column of each non-zero row, in row order. */
  readonly pivots: number[];
}

/** Reduced row echelon form; only the first `pivotLimit` columns may hold pivots. */
export function rref(input: readonly (readonly Fraction[])[], pivotLimit?: number): Rref {
  const m = input.map((row) => [...row]);
  const rows = m.length;
  const cols = rows === 0 ? 0 : (m[0] as Fraction[]).length;
  const limit = pivotLimit ?? cols;
  const pivots: number[] = [];
  let r = 0;
  for (let c = 0; c < limit && r < rows; c++) {
    let p = r;
    while (p < rows && isZero((m[p] as Fraction[])[c] as Fraction)) p++;
    if (p === rows) continue;
    [m[r], m[p]] = [m[p] as Fraction[], m[r] as Fraction[]];
    const pivotRow = m[r] as Fraction[];
    const inv = (pivotRow[c] as Fraction).inverse();
    for (let j = c; j < cols; j++) pivotRow[j] = (pivotRow[j] as Fraction).mul(inv);
    for (let i = 0; i < rows; i++) {
      if (i === r) continue;
      const row = m[i] as Fraction[];
      const factor = row[c] as Fraction;
      if (isZero(factor)) continue;
      for (let j = c; j < cols; j++)
        row[j] = (row[j] as Fraction).sub(factor.mul(pivotRow[j] as Fraction));
    }
    pivots.push(c);
    r++;
  }
  return { matrix: m, pivots };
}

/** Basis of { x : A x = 0 }, one vector per free column (that column set to 1). */
export function nullSpace(a: readonly (readonly Fraction[])[], cols: number): Fraction[][] {
  const { matrix, pivots } = rref(a, cols);
  const isPivot = new Array<boolean>(cols).fill(false);
  for (const p of pivots) isPivot[p] = true;
  const basis: Fraction[][] = [];
  for (let free = 0; free < cols; free++) {
    if (isPivot[free]) continue;
    const v = new Array<Fraction>(cols).fill(ZERO);
    v[free] = ONE;
    pivots.forEach((p, row) => {
      v[p] = ((matrix[row] as Fraction[])[free] as Fraction).neg();
    });
    basis.push(v);
  }
  return basis;
}

export type LinearSolution =
  | { readonly consistent: true; readonly particular: Fraction[]; readonly nullSpace: Fraction[][] }
  | { readonly consistent: false; readonly certificate: Fraction[] };

/**
 * Solves A x = b exactly. A consistent system gives the basic solution (free unknowns zero, so
 * the earliest independent columns are used) and the null space. An inconsistent one gives a
 * certificate y with yᵀA = 0 and yᵀb ≠ 0: the rows (equations) that contradict each other.
 */
export function solveLinear(
  a: readonly (readonly Fraction[])[],
  b: readonly Fraction[],
  cols: number,
): LinearSolution {
  const rows = a.length;
  // [A | b | I]: the identity block records the row operations, giving the certificate.
  const augmented = a.map((row, i) => {
    const out = [...row, b[i] as Fraction];
    for (let k = 0; k < rows; k++) out.push(k === i ? ONE : ZERO);
    return out;
  });
  const { matrix, pivots } = rref(augmented, cols);
  for (let i = pivots.length; i < rows; i++) {
    const row = matrix[i] as Fraction[];
    if (!isZero(row[cols] as Fraction))
      return { consistent: false, certificate: row.slice(cols + 1) };
  }
  const particular = new Array<Fraction>(cols).fill(ZERO);
  pivots.forEach((p, row) => {
    particular[p] = (matrix[row] as Fraction[])[cols] as Fraction;
  });
  const basis = nullSpace(
    a.map((row) => [...row]),
    cols,
  );
  return { consistent: true, particular, nullSpace: basis };
}

export function zeroMatrix(rows: number, cols: number): Matrix {
  return Array.from({ length: rows }, () => new Array<Fraction>(cols).fill(ZERO));
}
