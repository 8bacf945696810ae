import { and, eq, or, sql, type Column } from 'drizzle-orm';
import { revisions, sources, species, speciesPhases } from '../../../../schema';
import type { Queryable } from '../releases/releases-repository';

/** `column = any($1)` with the list as one array parameter: 20,000 keys stay one parameter. */
const anyOf = (column: Column, values: readonly (string | number)[], type: 'text' | 'int') =>
  sql`${column} = any(${sql.param(values)}::${sql.raw(type)}[])`;

/** Reads an upload checks against: the species, sources and accepted values it names. */
export const uploadsRepository = {
  /** Formula of each named species that exists (key → stored Hill formula). */
  async speciesFormulas(db: Queryable, keys: readonly string[]): Promise<Map<string, string>> {
    if (keys.length === 0) return new Map();
    const rows = await db
      .select({ key: species.key, formula: species.formula })
      .from(species)
      .where(anyOf(species.key, keys, 'text'));
    return new Map(rows.map((r) => [r.key, r.formula]));
  },

  /** Source reference as written (a key such as `codata-1989`, or an id) → source id. */
  async sourceIds(db: Queryable, refs: readonly string[]): Promise<Map<string, number>> {
    const keys = refs.filter((r) => !/^\d+$/.test(r));
    const ids = refs
      .filter((r) => /^[1-9]\d{0,9}$/.test(r))
      .map(Number)
      .filter((n) => n <= 2_147_483_647);
    if (keys.length === 0 && ids.length === 0) return new Map();
    const rows = await db
      .select({ id: sources.id, key: sources.key })
      .from(sources)
      .where(
        or(
          keys.length > 0 ? anyOf(sources.key, keys, 'text') : sql`false`,
          ids.length > 0 ? anyOf(sources.id, ids, 'int') : sql`false`,
        ),
      );
    const out = new Map<string, number>();
    for (const r of rows) {
      out.set(String(r.id), r.id);
      if (r.key !== null) out.set(r.key, r.id);
    }
    return out;
  },

  /**
   * Which species-phase quantities hold an accepted value now, as
   * `key|phase|modification|quantity`, for the named species.
   */
  async acceptedQuantities(db: Queryable, keys: readonly string[]): Promise<Set<string>> {
    if (keys.length === 0) return new Set();
    const rows = await db
      .select({
        key: species.key,
        phase: speciesPhases.phase,
        modification: speciesPhases.modification,
        quantity: revisions.quantity,
      })
      .from(revisions)
      .innerJoin(speciesPhases, eq(speciesPhases.id, revisions.speciesPhaseId))
      .innerJoin(species, eq(species.id, speciesPhases.speciesId))
      .where(and(eq(revisions.status, 'accepted'), anyOf(species.key, keys, 'text')));
    return new Set(rows.map((r) => valueKey(r.key, r.phase, r.modification, r.quantity)));
  },
};

export const valueKey = (
  key: string,
  phase: string,
  modification: string | null,
  quantity: string,
) => `${key}|${phase}|${modification ?? ''}|${quantity}`;
