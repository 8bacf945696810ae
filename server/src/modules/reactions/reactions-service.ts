import { AppError } from '../../lib/app-error';
import { THERMO_ERROR_STATUS } from '../../middleware/error-handler';
import { isThermoError, thermoJsonReplacer } from '../../thermo';
import type { ReleaseSnapshot } from '../releases/release-snapshot';
import { computeReaction, SAFETY_CAUTION } from './reaction-answer';
import type {
  BatchInput,
  BatchItem,
  BatchItemResult,
  ReactionBatchAnswer,
  ReactionEnthalpyAnswer,
  ReactionInput,
} from './reactions-schemas';

/**
 * The snapshot of a published release by version label (`latest` included), or null when no
 * such release is published. Published releases never change, so the source may cache forever.
 */
export type SnapshotSource = (version: string) => Promise<ReleaseSnapshot | null>;

export interface ReactionsService {
  /** The snapshot a request is answered from; 404 `unknown_release` when none. */
  release(version: string): Promise<ReleaseSnapshot>;
  compute(snap: ReleaseSnapshot, input: Omit<ReactionInput, 'release'>): ReactionEnthalpyAnswer;
  batch(snap: ReleaseSnapshot, input: Omit<BatchInput, 'release'>): ReactionBatchAnswer;
}

/** Items of one batch that get fuzzy suggestions for unknown species. */
export const BATCH_SUGGESTIONS = 50;

export function createReactionsService(snapshots: SnapshotSource): ReactionsService {
  return {
    async release(version) {
      const snap = await snapshots(version);
      if (!snap) {
        throw new AppError(404, 'unknown_release', `no published release ${version}`, {
          release: version,
        });
      }
      return snap;
    },
    compute(snap, input) {
      return { ...computeReaction(snap, input), caution: SAFETY_CAUTION };
    },
    batch(snap, input) {
      let errors = 0;
      // Fuzzy search costs far more than a reaction: a batch offers it for its first failures only.
      let suggestionsLeft = BATCH_SUGGESTIONS;
      const results = input.reactions.map((reaction, index): BatchItem => {
        const id = reaction.id ?? null;
        try {
          const answer = computeReaction(snap, {
            equation: reaction.equation,
            temperatureK: reaction.temperatureK ?? 298.15,
            unit: input.unit,
            suggest: suggestionsLeft > 0,
          });
          const item: BatchItemResult = {
            index,
            id,
            equation: answer.equation,
            temperatureK: answer.temperatureK,
            deltaH: answer.deltaH,
            uncertainty: answer.uncertainty,
            uncertaintyBasis: answer.uncertaintyBasis,
            terms: answer.terms,
            assumptions: answer.assumptions,
          };
          if (answer.deltaH298 !== undefined) item.deltaH298 = answer.deltaH298;
          return item;
        } catch (err) {
          errors++;
          suggestionsLeft--;
          return { index, id, error: errorBody(err) };
        }
      });
      return {
        release: snap.version,
        unit: input.unit,
        count: results.length,
        errors,
        results,
        caution: SAFETY_CAUTION,
      };
    },
  };
}

/**
 * The error a single request would answer, for one batch item. Only expected failures
 * (AppError, ThermoError) become item errors; anything else is a fault and fails the batch.
 */
function errorBody(err: unknown): { status: number; code: string; message: string } {
  if (err instanceof AppError) {
    return { status: err.status, code: err.code, message: err.message, ...err.details };
  }
  if (isThermoError(err)) {
    return {
      // As the error handler answers a single request.
      status: THERMO_ERROR_STATUS[err.code],
      code: err.code,
      message: err.message,
      ...plain(err.details),
    };
  }
  throw err;
}

/** Engine details may hold exact fractions: written as text, as the app's JSON replacer does. */
function plain(details: Record<string, unknown>): Record<string, unknown> {
  return JSON.parse(JSON.stringify(details, thermoJsonReplacer)) as Record<string, unknown>;
}
