import type { UncertaintyBasis } from './formation-data';

export type CombinedBasis = UncertaintyBasis | 'mixed';

/**
 * Combination of independent uncertainties in quadrature, u = √Σ(cᵢ·uᵢ)², as in Martinho Simões &
 * Minas da Piedade, Molecular Energetics (OUP 2008), §2.6. Inputs are added one by one.
 *
 * Choices: an input without an uncertainty makes the result null (a combined figure would claim
 * more than the data supports); an exact input (an element in its reference state) adds zero
 * and does not take part in the basis; a given uncertainty without a stated basis counts as
 * 'as_stated'; inputs of different bases give 'mixed', and no conversion between bases is made.
 */
export class QuadratureSum {
  private total = 0;
  private unknown = false;
  private basis: CombinedBasis | null = null;

  addExact(): void {
    // An exact value contributes nothing.
  }

  add(
    scaledUncertainty: number | null | undefined,
    basis: UncertaintyBasis | null | undefined,
  ): void {
    if (scaledUncertainty === null || scaledUncertainty === undefined) {
      this.unknown = true;
      return;
    }
    // Math.hypot scales internally: no underflow at 1e-200, no overflow near 1e308.
    this.total = Math.hypot(this.total, scaledUncertainty);
    const b: UncertaintyBasis = basis ?? 'as_stated';
    this.basis = this.basis === null || this.basis === b ? b : 'mixed';
  }

  get uncertainty(): number | null {
    return this.unknown ? null : this.total;
  }

  get combinedBasis(): CombinedBasis | null {
    return this.unknown ? null : this.basis;
  }
}
