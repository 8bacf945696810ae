import type { UserRow } from '../../../../schema';
import type { Clock } from '../../adapters';
import type { Database } from '../../db/client';
import { AppError, notFound } from '../../lib/app-error';
import type { TokenVerifier } from '../../middleware/bearer-auth';
import { recordAudit } from '../audit/audit-repository';
import { generateToken, hashMatches, hashToken, tokenPrefix } from './token-format';
import { tokensRepository } from './tokens-repository';

/** Active tokens one user may hold: plenty for scripts, a bound on what a mistake can create. */
export const MAX_ACTIVE_TOKENS = 50;
/** The last-use stamp is written at most this often per token. */
export const LAST_USED_EVERY_MS = 60_000;

export interface TokensServiceDeps {
  db: Database;
  clock: Clock;
  /** HMAC key the tokens are stored under (TOKEN_HASH_KEY). */
  hashKey: string;
}

export function createTokensService({ db, clock, hashKey }: TokensServiceDeps) {
  /** The verifier behind `Authorization: Bearer …`: the token's user, or null (→ 401). */
  const verify: TokenVerifier = async (token) => {
    const prefix = tokenPrefix(token);
    if (!prefix) return null;
    const found = await tokensRepository.findActiveByPrefix(db, prefix);
    if (!found || !hashMatches(token, found.token.hash, hashKey)) return null;
    const now = clock.now();
    const last = found.token.lastUsedAt?.getTime() ?? -Infinity;
    if (now.getTime() - last >= LAST_USED_EVERY_MS) {
      await tokensRepository.touch(db, found.token.id, now, LAST_USED_EVERY_MS);
    }
    return found.user;
  };

  return {
    verify,

    list: (userId: number) => tokensRepository.listActive(db, userId),

    /** Creates a named token with its audit row; the whole token is returned this once. */
    create(actor: UserRow, name: string) {
      return db.transaction(async (tx) => {
        if ((await tokensRepository.countActive(tx, actor.id)) >= MAX_ACTIVE_TOKENS) {
          throw new AppError(
            409,
            'token_limit',
            `You already hold ${MAX_ACTIVE_TOKENS} active tokens; revoke one you no longer use`,
          );
        }
        const { token, prefix } = generateToken();
        const row = await tokensRepository.insert(tx, {
          userId: actor.id,
          name,
          prefix,
          hash: hashToken(token, hashKey),
        });
        await recordAudit(tx, {
          actorId: actor.id,
          action: 'token.created',
          entityType: 'api_token',
          entityId: row.id,
          after: { name, prefix },
        });
        return { token, row };
      });
    },

    /** Revokes one of the actor's own tokens; someone else's is 404. Revoking twice is a no-op. */
    revoke(actor: UserRow, id: number): Promise<void> {
      return db.transaction(async (tx) => {
        const row = await tokensRepository.findOwnForUpdate(tx, actor.id, id);
        if (!row) throw notFound(`Token ${id}`);
        if (row.revokedAt) return;
        const at = clock.now();
        await tokensRepository.revoke(tx, id, at);
        await recordAudit(tx, {
          actorId: actor.id,
          action: 'token.revoked',
          entityType: 'api_token',
          entityId: id,
          before: { name: row.name, prefix: row.prefix },
          after: { revokedAt: at.toISOString() },
        });
      });
    },
  };
}

export type TokensService = ReturnType<typeof createTokensService>;
