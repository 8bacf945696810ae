import { and, desc, eq, ilike, or, sql } from 'drizzle-orm';
import { sourceDocuments, sources, users, type SourceRow } from '../../../../schema';
import type { Database, Tx } from '../../db/client';

type Queryable = Database | Tx;

export interface NewSource {
  csl: Record<string, unknown>;
  citation: string;
  doi: string | null;
  createdBy: number;
}

export interface DocumentRow {
  id: number;
  sourceId: number;
  key: string;
  fileName: string;
  size: number;
  sha256: string;
  uploadedAt: Date;
  uploadedBy: number;
  uploaderLogin: string;
  uploaderName: string;
}

const documentColumns = {
  id: sourceDocuments.id,
  sourceId: sourceDocuments.sourceId,
  key: sourceDocuments.key,
  fileName: sourceDocuments.fileName,
  size: sourceDocuments.size,
  sha256: sourceDocuments.sha256,
  uploadedAt: sourceDocuments.uploadedAt,
  uploadedBy: sourceDocuments.uploadedBy,
  uploaderLogin: users.login,
  uploaderName: users.name,
};

/** `%` and `_` typed by a person are literal characters, not patterns. */
const likeText = (q: string) => `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export const sourcesRepository = {
  async findById(db: Queryable, id: number): Promise<SourceRow | undefined> {
    const [row] = await db.select().from(sources).where(eq(sources.id, id));
    return row;
  },

  async findByDoi(db: Queryable, doi: string): Promise<SourceRow | undefined> {
    const [row] = await db.select().from(sources).where(eq(sources.doi, doi));
    return row;
  },

  /** Inserts unless the DOI is taken (the partial unique index decides, also under races). */
  async insertUnlessDoiTaken(tx: Tx, row: NewSource): Promise<SourceRow | undefined> {
    const [inserted] = await tx
      .insert(sources)
      .values(row)
      .onConflictDoNothing({ target: sources.doi, where: sql`${sources.doi} is not null` })
      .returning();
    return inserted;
  },

  async list(db: Queryable, q: string | undefined, limit: number, offset: number) {
    const where = q
      ? or(ilike(sources.citation, likeText(q)), ilike(sources.doi, likeText(q)))
      : undefined;
    const [items, [count]] = await Promise.all([
      db
        .select()
        .from(sources)
        .where(where)
        .orderBy(desc(sources.createdAt), desc(sources.id))
        .limit(limit)
        .offset(offset),
      db
        .select({ n: sql<number>`count(*)::int` })
        .from(sources)
        .where(where),
    ]);
    return { items, total: count?.n ?? 0 };
  },

  async insertDocument(
    tx: Tx,
    row: typeof sourceDocuments.$inferInsert,
  ): Promise<typeof sourceDocuments.$inferSelect> {
    const [inserted] = await tx.insert(sourceDocuments).values(row).returning();
    return inserted!;
  },

  /** A source's documents, oldest first; only one uploader's when `uploadedBy` is given. */
  listDocuments(db: Queryable, sourceId: number, uploadedBy?: number): Promise<DocumentRow[]> {
    return db
      .select(documentColumns)
      .from(sourceDocuments)
      .innerJoin(users, eq(users.id, sourceDocuments.uploadedBy))
      .where(
        and(
          eq(sourceDocuments.sourceId, sourceId),
          uploadedBy === undefined ? undefined : eq(sourceDocuments.uploadedBy, uploadedBy),
        ),
      )
      .orderBy(sourceDocuments.id);
  },

  async findDocument(
    db: Queryable,
    sourceId: number,
    docId: number,
  ): Promise<DocumentRow | undefined> {
    const [row] = await db
      .select(documentColumns)
      .from(sourceDocuments)
      .innerJoin(users, eq(users.id, sourceDocuments.uploadedBy))
      .where(and(eq(sourceDocuments.sourceId, sourceId), eq(sourceDocuments.id, docId)));
    return row;
  },
};
