import { and, asc, eq, or, sql, type SQL } from 'drizzle-orm';
import {
  proposalComments,
  proposalItems,
  proposals,
  species,
  users,
  type ProposalCommentRow,
  type ProposalItemRow,
  type ProposalRow,
} from '../../../../schema';
import type { Database, Tx } from '../../db/client';
import type { ResolvedItem } from './item-check';
import type { ProposalListQuery, ProposalStatus } from './proposals-schemas';

type Queryable = Database | Tx;

export const CHUNK = 1000;
export const chunks = <T>(list: readonly T[]) =>
  Array.from({ length: Math.ceil(list.length / CHUNK) }, (_, i) =>
    list.slice(i * CHUNK, (i + 1) * CHUNK),
  );

export interface ListRow extends ProposalRow {
  authorLogin: string;
  authorName: string;
  deciderLogin: string | null;
  deciderName: string | null;
  itemCount: number;
  kinds: string[];
  speciesKeys: string[];
  commentCount: number;
  stale: boolean;
}

/** A derive item or derived revision is stale when an input is no longer the accepted value. */
const staleItemSql = (items: string) =>
  sql.raw(`exists (
  select 1 from unnest(${items}.input_revision_ids) as i(id)
  join revisions ir on ir.id = i.id where ir.status in ('superseded', 'retired'))`);

export const proposalsRepository = {
  async speciesByKey(db: Queryable, key: string) {
    const [row] = await db
      .select({ formula: species.formula, charge: species.charge })
      .from(species)
      .where(eq(species.key, key));
    return row;
  },

  /** An add_species item of the proposal, for the species it will create. */
  async addedSpecies(db: Queryable, proposalId: number, key: string) {
    const [row] = await db
      .select({ input: proposalItems.input })
      .from(proposalItems)
      .where(
        and(
          eq(proposalItems.proposalId, proposalId),
          eq(proposalItems.kind, 'add_species'),
          eq(proposalItems.speciesKey, key),
        ),
      );
    return row?.input as { formula: string; charge: number } | undefined;
  },

  async insertProposal(tx: Tx, authorId: number, rationale: string): Promise<ProposalRow> {
    const [row] = await tx.insert(proposals).values({ authorId, rationale }).returning();
    return row!;
  },

  async insertItems(tx: Tx, proposalId: number, items: readonly ResolvedItem[]): Promise<void> {
    for (const part of chunks(items)) {
      await tx.insert(proposalItems).values(
        part.map((i) => ({
          proposalId,
          seq: i.seq,
          kind: i.kind,
          input: i.input as Record<string, unknown>,
          speciesKey: i.speciesKey,
          phase: i.phase,
          modification: i.modification,
          quantity: i.quantity,
          value: i.value,
          uncertainty: i.uncertainty,
          sourceId: i.sourceId,
          targetRevisionId: i.targetRevisionId,
          derivation: i.derivation,
          inputRevisionIds: i.inputRevisionIds,
        })),
      );
    }
  },

  async deleteItems(tx: Tx, proposalId: number): Promise<void> {
    await tx.delete(proposalItems).where(eq(proposalItems.proposalId, proposalId));
  },

  async lock(tx: Tx, id: number): Promise<ProposalRow | undefined> {
    const [row] = await tx.select().from(proposals).where(eq(proposals.id, id)).for('update');
    return row;
  },

  async find(db: Queryable, id: number): Promise<ProposalRow | undefined> {
    const [row] = await db.select().from(proposals).where(eq(proposals.id, id));
    return row;
  },

  itemsOf(db: Queryable, proposalId: number): Promise<ProposalItemRow[]> {
    return db
      .select()
      .from(proposalItems)
      .where(eq(proposalItems.proposalId, proposalId))
      .orderBy(asc(proposalItems.seq));
  },

  async update(
    tx: Tx,
    id: number,
    patch: Partial<
      Pick<ProposalRow, 'status' | 'rationale' | 'submittedAt' | 'decidedBy' | 'decidedAt'>
    >,
  ): Promise<ProposalRow> {
    const [row] = await tx
      .update(proposals)
      .set({ ...patch, updatedAt: sql`now()` })
      .where(eq(proposals.id, id))
      .returning();
    return row!;
  },

  async setItem(
    tx: Tx,
    itemId: number,
    patch: Partial<Pick<ProposalItemRow, 'targetRevisionId' | 'createdRevisionId'>>,
  ): Promise<void> {
    await tx.update(proposalItems).set(patch).where(eq(proposalItems.id, itemId));
  },

  async insertComment(
    tx: Tx,
    c: Pick<ProposalCommentRow, 'proposalId' | 'authorId' | 'body' | 'decision'>,
  ): Promise<ProposalCommentRow> {
    const [row] = await tx.insert(proposalComments).values(c).returning();
    return row!;
  },

  commentsOf(db: Queryable, proposalId: number) {
    return db
      .select({
        comment: proposalComments,
        login: users.login,
        name: users.name,
      })
      .from(proposalComments)
      .innerJoin(users, eq(users.id, proposalComments.authorId))
      .where(eq(proposalComments.proposalId, proposalId))
      .orderBy(asc(proposalComments.createdAt), asc(proposalComments.id));
  },

  /** Users for event payloads: the author, the actor and everyone in the thread. */
  async participants(db: Queryable, proposalId: number) {
    return db
      .selectDistinct({ id: users.id, login: users.login, name: users.name, email: users.email })
      .from(users)
      .where(
        or(
          sql`${users.id} in (select author_id from proposal_comments where proposal_id = ${proposalId})`,
          sql`${users.id} in (select decided_by from proposals where id = ${proposalId})`,
        ),
      );
  },

  async userById(db: Queryable, id: number) {
    const [u] = await db
      .select({ id: users.id, login: users.login, name: users.name, email: users.email })
      .from(users)
      .where(eq(users.id, id));
    return u!;
  },

  /** The review queue: filtered, sorted, paged; drafts only for their author. */
  async list(
    db: Queryable,
    viewerId: number,
    q: Pick<ProposalListQuery, 'sort' | 'order' | 'offset' | 'limit'> & Partial<ProposalListQuery>,
    ids?: number[],
  ): Promise<{ rows: ListRow[]; total: number }> {
    const where: SQL[] = [sql`(p.status <> 'draft' or p.author_id = ${viewerId})`];
    if (ids)
      where.push(
        sql`p.id in (${sql.join(
          ids.map((i) => sql`${i}`),
          sql`, `,
        )})`,
      );
    if (q.status)
      where.push(
        sql`p.status in (${sql.join(
          q.status.map((s: ProposalStatus) => sql`${s}`),
          sql`, `,
        )})`,
      );
    if (q.author === 'me') where.push(sql`p.author_id = ${viewerId}`);
    else if (q.author) where.push(sql`a.login = ${q.author}`);
    if (q.species)
      where.push(
        sql`exists (select 1 from proposal_items x where x.proposal_id = p.id and x.species_key = ${q.species})`,
      );
    const staleExpr = sql`exists (select 1 from proposal_items x where x.proposal_id = p.id and x.kind = 'derive_value' and ${staleItemSql('x')})`;
    if (q.stale === 'true') where.push(staleExpr);
    if (q.stale === 'false') where.push(sql`not ${staleExpr}`);
    const column = {
      updatedAt: 'p.updated_at',
      createdAt: 'p.created_at',
      submittedAt: 'p.submitted_at',
      id: 'p.id',
      status: 'p.status',
    }[q.sort];
    const order = sql.raw(
      `${column} ${q.order === 'asc' ? 'asc' : 'desc'} nulls last, p.id ${q.order}`,
    );
    const from = sql`from proposals p
      join users a on a.id = p.author_id
      left join users d on d.id = p.decided_by
      where ${sql.join(where, sql` and `)}`;
    const { rows } = await db.execute<Record<string, unknown>>(sql`
      select p.id, p.author_id, p.rationale, p.status, p.created_at, p.updated_at, p.submitted_at,
             p.decided_by, p.decided_at, a.login as author_login, a.name as author_name,
             d.login as decider_login, d.name as decider_name,
             (select count(*)::int from proposal_items x where x.proposal_id = p.id) as item_count,
             (select coalesce(array_agg(distinct x.kind::text), '{}') from proposal_items x where x.proposal_id = p.id) as kinds,
             (select coalesce(array_agg(k), '{}') from (select distinct x.species_key as k from proposal_items x
                where x.proposal_id = p.id and x.species_key is not null order by 1 limit 5) s) as species_keys,
             (select count(*)::int from proposal_comments c where c.proposal_id = p.id) as comment_count,
             ${staleExpr} as stale
      ${from}
      order by ${order}
      offset ${q.offset} limit ${q.limit}`);
    const [{ total }] = (
      await db.execute<{ total: number }>(sql`select count(*)::int as total ${from}`)
    ).rows as [{ total: number }];
    const date = (v: unknown) => (v == null ? null : new Date(v as string));
    const list = rows.map((r): ListRow => ({
      id: r.id as number,
      authorId: r.author_id as number,
      rationale: r.rationale as string,
      status: r.status as ProposalStatus,
      createdAt: date(r.created_at)!,
      updatedAt: date(r.updated_at)!,
      submittedAt: date(r.submitted_at),
      decidedBy: r.decided_by as number | null,
      decidedAt: date(r.decided_at),
      authorLogin: r.author_login as string,
      authorName: r.author_name as string,
      deciderLogin: r.decider_login as string | null,
      deciderName: r.decider_name as string | null,
      itemCount: r.item_count as number,
      kinds: r.kinds as string[],
      speciesKeys: r.species_keys as string[],
      commentCount: r.comment_count as number,
      stale: r.stale as boolean,
    }));
    return { rows: list, total };
  },
};
