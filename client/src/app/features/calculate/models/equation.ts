/** One term of a parsed equation; `coefficient` is negative for reactants. */
export interface ParsedSpecies {
  formula: string;
  phase: string;
  coefficient: number;
}

/** Body of `POST /api/v1/equations/parse`. */
export interface EquationText {
  equation: string;
}

/** Answer of `POST /api/v1/equations/parse`. */
export interface ParsedEquation {
  normalized: string;
  /**
   * Whether elements and charge balance. The engine answers null when a term is a registry key
   * (e.g. `[2-methylpropane](g)`) whose composition it does not know; the client accepts both.
   */
  balanced: boolean | null;
  /** Per element, the atoms left over (products minus reactants); empty when balanced. */
  imbalance: Record<string, number>;
  charge: number;
  suggestion: string | null;
  species: ParsedSpecies[];
}
