import { fromJoulesPerMole } from '../../thermo';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import { SAFETY_CAUTION } from '../reactions/reaction-answer';
import type { ReactionsService } from '../reactions/reactions-service';
import type { BatchItem, ReactionUnitName } from '../reactions/reactions-schemas';
import {
  STANDARD_TEMPERATURE_K,
  type ImpactAnswer,
  type ImpactItem,
  type ImpactSide,
  type WatchedReaction,
} from './watchlists-schemas';

export interface ImpactInput {
  reactions: readonly WatchedReaction[];
  /** For reactions without a temperature of their own; 298.15 K when absent. */
  temperatureK?: number;
  unit: ReactionUnitName;
  watchlistId?: number | null;
}

/**
 * ΔrH of each reaction in two releases and the change between them. Both sides go through the
 * reactions service's batch (the one engine, per-item errors as a batch gives them), in J/mol,
 * so the change is taken before any unit conversion: a changed ΔfH° of one term moves ΔrH by
 * exactly ν × that change. The combined uncertainty is the root sum of squares of the two.
 */
export function impactReport(
  reactions: ReactionsService,
  from: ReleaseSnapshot,
  to: ReleaseSnapshot,
  input: ImpactInput,
): ImpactAnswer {
  const batch = input.reactions.map((r, i) => ({
    id: i,
    equation: r.equation,
    temperatureK: r.temperatureK ?? input.temperatureK ?? STANDARD_TEMPERATURE_K,
  }));
  const a = reactions.batch(from, { unit: 'J/mol', reactions: batch }).results;
  const b = reactions.batch(to, { unit: 'J/mol', reactions: batch }).results;
  const out = (j: number) => fromJoulesPerMole(j, input.unit);

  let errors = 0;
  let exceeding = 0;
  const results = input.reactions.map((r, i): ImpactItem => {
    const before = a[i]!;
    const after = b[i]!;
    const item: ImpactItem = {
      index: i,
      label: r.label ?? null,
      input: r.equation,
      temperatureK: batch[i]!.temperatureK,
      from: side(before, out),
      to: side(after, out),
      change: null,
      combinedUncertainty: null,
      exceedsUncertainty: null,
    };
    if ('error' in before || 'error' in after) {
      errors++;
      return item;
    }
    const change = after.deltaH - before.deltaH;
    item.change = out(change);
    if (before.uncertainty !== null && after.uncertainty !== null) {
      const combined = Math.hypot(before.uncertainty, after.uncertainty);
      item.combinedUncertainty = out(combined);
      item.exceedsUncertainty = Math.abs(change) > combined;
      if (item.exceedsUncertainty) exceeding++;
    }
    return item;
  });
  return {
    from: from.version,
    to: to.version,
    unit: input.unit,
    watchlistId: input.watchlistId ?? null,
    count: results.length,
    errors,
    exceeding,
    results,
    caution: SAFETY_CAUTION,
  };
}

function side(item: BatchItem, out: (j: number) => number): ImpactSide {
  if ('error' in item) {
    // Energies in an error's details stay as the engine stated them (J/mol).
    return { error: item.error };
  }
  return {
    equation: item.equation,
    deltaH: out(item.deltaH),
    uncertainty: item.uncertainty === null ? null : out(item.uncertainty),
    uncertaintyBasis: item.uncertaintyBasis,
  };
}
