import { and, asc, count, eq, sql } from 'drizzle-orm';
import { users, watchlists, type WatchedReaction, type WatchlistRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';

type Queryable = Database | Tx;

export const watchlistsRepository = {
  listOwn(db: Queryable, ownerId: number): Promise<WatchlistRow[]> {
    return db
      .select()
      .from(watchlists)
      .where(eq(watchlists.ownerId, ownerId))
      .orderBy(asc(watchlists.name), asc(watchlists.id));
  },

  /** One of the owner's watchlists; someone else's is simply not found. */
  async findOwn(db: Queryable, ownerId: number, id: number): Promise<WatchlistRow | undefined> {
    const [row] = await db
      .select()
      .from(watchlists)
      .where(and(eq(watchlists.id, id), eq(watchlists.ownerId, ownerId)));
    return row;
  },

  async findOwnForUpdate(tx: Tx, ownerId: number, id: number) {
    const [row] = await tx
      .select()
      .from(watchlists)
      .where(and(eq(watchlists.id, id), eq(watchlists.ownerId, ownerId)))
      .for('update');
    return row;
  },

  async countOwn(tx: Tx, ownerId: number): Promise<number> {
    const [row] = await tx
      .select({ n: count() })
      .from(watchlists)
      .where(eq(watchlists.ownerId, ownerId));
    return row?.n ?? 0;
  },

  async insert(
    tx: Tx,
    values: { ownerId: number; name: string; reactions: WatchedReaction[] },
  ): Promise<WatchlistRow> {
    const [row] = await tx.insert(watchlists).values(values).returning();
    return row!;
  },

  async update(
    tx: Tx,
    id: number,
    values: { name: string; reactions: WatchedReaction[] },
  ): Promise<WatchlistRow> {
    const [row] = await tx
      .update(watchlists)
      .set({ ...values, updatedAt: sql`now()` })
      .where(eq(watchlists.id, id))
      .returning();
    return row!;
  },

  async delete(tx: Tx, id: number): Promise<void> {
    await tx.delete(watchlists).where(eq(watchlists.id, id));
  },

  /** Every watchlist that holds reactions, with its owner, for the reports sent on publish. */
  withOwners(db: Queryable) {
    return db
      .select({
        watchlist: watchlists,
        owner: { id: users.id, login: users.login, name: users.name, email: users.email },
      })
      .from(watchlists)
      .innerJoin(users, eq(users.id, watchlists.ownerId))
      .where(sql`jsonb_array_length(${watchlists.reactions}) > 0`)
      .orderBy(asc(watchlists.ownerId), asc(watchlists.id));
  },
};
