import { and, asc, count, eq, isNull, lt, or } from 'drizzle-orm';
import { apiTokens, users, type ApiTokenRow, type UserRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';

type Queryable = Database | Tx;

export const tokensRepository = {
  /** The active token with this prefix and the user it stands for (role read afresh). */
  async findActiveByPrefix(
    db: Queryable,
    prefix: string,
  ): Promise<{ token: ApiTokenRow; user: UserRow } | undefined> {
    const [row] = await db
      .select({ token: apiTokens, user: users })
      .from(apiTokens)
      .innerJoin(users, eq(users.id, apiTokens.userId))
      .where(and(eq(apiTokens.prefix, prefix), isNull(apiTokens.revokedAt)));
    return row;
  },

  listActive(db: Queryable, userId: number): Promise<ApiTokenRow[]> {
    return db
      .select()
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
      .orderBy(asc(apiTokens.createdAt), asc(apiTokens.id));
  },

  async countActive(tx: Tx, userId: number): Promise<number> {
    const [row] = await tx
      .select({ n: count() })
      .from(apiTokens)
      .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)));
    return row?.n ?? 0;
  },

  async insert(
    tx: Tx,
    values: { userId: number; name: string; prefix: string; hash: string },
  ): Promise<ApiTokenRow> {
    const [row] = await tx.insert(apiTokens).values(values).returning();
    return row!;
  },

  async findOwnForUpdate(tx: Tx, userId: number, id: number): Promise<ApiTokenRow | undefined> {
    const [row] = await tx
      .select()
      .from(apiTokens)
      .where(and(eq(apiTokens.id, id), eq(apiTokens.userId, userId)))
      .for('update');
    return row;
  },

  async revoke(tx: Tx, id: number, at: Date): Promise<void> {
    await tx.update(apiTokens).set({ revokedAt: at }).where(eq(apiTokens.id, id));
  },

  /** Stamps the last use unless another request did within the last `everyMs`. */
  async touch(db: Queryable, id: number, at: Date, everyMs: number): Promise<void> {
    const before = new Date(at.getTime() - everyMs);
    await db
      .update(apiTokens)
      .set({ lastUsedAt: at })
      .where(
        and(
          eq(apiTokens.id, id),
          or(isNull(apiTokens.lastUsedAt), lt(apiTokens.lastUsedAt, before)),
        ),
      );
  },
};
