import { z } from 'zod';
import type { ApiTokenRow } from '../../../../schema';
import { IdParams } from '../../middleware/validate';

/**
 * The contract of the API token routes (`/api/v1/me/tokens`). The client imports the inferred
 * types with `import type` only.
 */

// ---- POST /api/v1/me/tokens ----
export const CreateTokenBody = z
  .object({
    /** What the token is for, in the owner's words ("nightly simulator sync"). */
    name: z.string().trim().min(1, 'is empty').max(100, 'is longer than 100 characters'),
  })
  .strict();

// ---- DELETE /api/v1/me/tokens/:id ----
export const TokenIdParams = IdParams;

// ---- answers ----
export const TokenView = z.object({
  id: z.number().int(),
  name: z.string(),
  /** `thp_` and the token's public id part; the rest is never shown again. */
  prefix: z.string(),
  /** ISO 8601. */
  createdAt: z.string(),
  /** ISO 8601; recorded at most once a minute. */
  lastUsedAt: z.string().nullable(),
});

/** `POST /api/v1/me/tokens` (201): the whole token, this once. */
export const CreatedTokenAnswer = z.object({
  token: z.string(),
  apiToken: TokenView,
});

/** `GET /api/v1/me/tokens`: active tokens, oldest first. */
export const TokenListAnswer = z.object({ tokens: z.array(TokenView) });

export type CreateTokenRequest = z.input<typeof CreateTokenBody>;
export type TokenView = z.infer<typeof TokenView>;
export type CreatedTokenAnswer = z.infer<typeof CreatedTokenAnswer>;
export type TokenListAnswer = z.infer<typeof TokenListAnswer>;

export function toTokenView(t: ApiTokenRow): TokenView {
  return {
    id: t.id,
    name: t.name,
    prefix: t.prefix,
    createdAt: t.createdAt.toISOString(),
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
  };
}
