import { z } from 'zod';
import type { WatchlistRow } from '../../../../schema';
import { IdParams, INT4_MAX } from '../../middleware/validate';
import {
  EquationText,
  ErrorBody,
  ReactionUnit,
  STANDARD_TEMPERATURE_K,
  TemperatureK,
} from '../reactions/reactions-schemas';

/**
 * The contract of watchlists (`/api/v1/me/watchlists`) and impact reports
 * (`POST /api/v1/releases/:a/impact/:b`). The client imports the inferred types with
 * `import type` only.
 */
export const WATCHLIST_MAX_REACTIONS = 1000;
export const IMPACT_MAX_EQUATIONS = 1000;

export const WatchedReaction = z
  .object({
    equation: EquationText,
    label: z.string().trim().max(200, 'is longer than 200 characters').optional(),
    temperatureK: TemperatureK.optional(),
  })
  .strict();

// ---- POST /api/v1/me/watchlists, PUT /api/v1/me/watchlists/:id ----
export const WatchlistBody = z
  .object({
    name: z.string().trim().min(1, 'is empty').max(100, 'is longer than 100 characters'),
    reactions: z
      .array(WatchedReaction)
      .max(WATCHLIST_MAX_REACTIONS, `takes at most ${WATCHLIST_MAX_REACTIONS} reactions`),
  })
  .strict();

export const WatchlistIdParams = IdParams;

// ---- POST /api/v1/releases/:a/impact/:b ----
const releaseLabel = z.string().min(1).max(64);
export const ImpactParams = z.object({ a: releaseLabel, b: releaseLabel });

export const ImpactBody = z
  .object({
    equations: z
      .array(EquationText)
      .min(1, 'needs at least one equation')
      .max(IMPACT_MAX_EQUATIONS, `takes at most ${IMPACT_MAX_EQUATIONS} equations`)
      .optional(),
    /** One of the caller's own watchlists instead of `equations`. */
    watchlistId: z.number().int().positive().max(INT4_MAX).optional(),
    /** For every equation (a watchlist's own temperatures win). */
    temperatureK: TemperatureK.optional(),
    unit: ReactionUnit.default('kJ/mol'),
  })
  .strict()
  .refine((b) => (b.equations === undefined) !== (b.watchlistId === undefined), {
    message: 'give either equations or watchlistId',
    path: ['equations'],
  });

// ---- answers ----
export const WatchlistView = z.object({
  id: z.number().int(),
  name: z.string(),
  reactions: z.array(WatchedReaction),
  /** ISO 8601. */
  createdAt: z.string(),
  updatedAt: z.string(),
});
export const WatchlistSummary = WatchlistView.omit({ reactions: true }).extend({
  count: z.number().int(),
});
export const WatchlistAnswer = z.object({ watchlist: WatchlistView });
export const WatchlistListAnswer = z.object({ watchlists: z.array(WatchlistSummary) });

/** ΔrH of one reaction in one release, or the error that release answers for it. */
export const ImpactSide = z.union([
  z.object({
    /** As computed in that release (phases filled in, canonical notation). */
    equation: z.string(),
    deltaH: z.number(),
    uncertainty: z.number().nullable(),
    uncertaintyBasis: z.string(),
  }),
  z.object({ error: ErrorBody.extend({ status: z.number().int() }) }),
]);

export const ImpactItem = z.object({
  index: z.number().int(),
  label: z.string().nullable(),
  /** The equation as given. */
  input: z.string(),
  temperatureK: z.number(),
  from: ImpactSide,
  to: ImpactSide,
  /** ΔrH(to) − ΔrH(from); null when either release cannot compute the reaction. */
  change: z.number().nullable(),
  /** Root sum of squares of the two uncertainties; null when either is not stated. */
  combinedUncertainty: z.number().nullable(),
  /** |change| > combined uncertainty; null when there is no combined uncertainty. */
  exceedsUncertainty: z.boolean().nullable(),
});

export const ImpactAnswer = z.object({
  from: z.string(),
  to: z.string(),
  unit: ReactionUnit,
  watchlistId: z.number().int().nullable(),
  count: z.number().int(),
  /** Items that either release could not compute. */
  errors: z.number().int(),
  /** Items whose change exceeds the combined uncertainty. */
  exceeding: z.number().int(),
  results: z.array(ImpactItem),
  caution: z.string(),
});

export type WatchedReaction = z.infer<typeof WatchedReaction>;
export type WatchlistRequest = z.input<typeof WatchlistBody>;
export type WatchlistView = z.infer<typeof WatchlistView>;
export type WatchlistSummary = z.infer<typeof WatchlistSummary>;
export type WatchlistAnswer = z.infer<typeof WatchlistAnswer>;
export type WatchlistListAnswer = z.infer<typeof WatchlistListAnswer>;
export type ImpactRequest = z.input<typeof ImpactBody>;
export type ImpactSide = z.infer<typeof ImpactSide>;
export type ImpactItem = z.infer<typeof ImpactItem>;
export type ImpactAnswer = z.infer<typeof ImpactAnswer>;

export { STANDARD_TEMPERATURE_K };

export function toWatchlistView(w: WatchlistRow): WatchlistView {
  return {
    id: w.id,
    name: w.name,
    reactions: w.reactions,
    createdAt: w.createdAt.toISOString(),
    updatedAt: w.updatedAt.toISOString(),
  };
}

export function toWatchlistSummary(w: WatchlistRow): WatchlistSummary {
  const { reactions, ...rest } = toWatchlistView(w);
  return { ...rest, count: reactions.length };
}
