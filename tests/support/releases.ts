import { sql } from 'drizzle-orm';
import type { Tx } from '../../server/src/db/client';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import type { TestApp } from './test-app';

/**
 * Publishes a second release, `2026.2`, in which liquid water's accepted ΔfH° moved by
 * `changeJPerMol` (0.5 kJ/mol unless given; test data), through the release service as an editor
 * would. Browser tests call it before the page first reads the release list, which the client may
 * cache for a minute.
 */
export async function publishRevisedWater(
  t: TestApp,
  changeJPerMol = 500,
  notes = 'Water revised (test data)',
): Promise<void> {
  await publishAccepted(t, '2026.2', notes, async (tx) => {
    await tx.execute(sql`
      with old as (
        update revisions r set status = 'superseded', status_changed_at = now()
        from species_phases sp join species s on s.id = sp.species_id
        where sp.id = r.species_phase_id and s.key = 'water' and sp.phase = 'l'
          and r.quantity = 'formation_enthalpy' and r.status = 'accepted'
        returning r.*)
      insert into revisions (species_phase_id, kind, quantity, value, uncertainty,
        uncertainty_basis, method, standard_pressure, source_id, status, supersedes_id)
      select species_phase_id, kind, quantity, value + ${changeJPerMol}, uncertainty,
        uncertainty_basis, method, standard_pressure, source_id, 'accepted', id from old`);
  });
}

/**
 * Publishes the accepted revisions as release `version` through the release service, as
 * demo-editor, after `prepare` (if given) has changed them in the same transaction.
 */
export async function publishAccepted(
  t: TestApp,
  version: string,
  notes: string,
  prepare?: (tx: Tx) => Promise<void>,
): Promise<void> {
  const editor = (await t.db.pool.query(`select id from users where login = 'demo-editor'`))
    .rows[0] as { id: number };
  const releases = createReleasesService(t.db.db);
  await t.db.db.transaction(async (tx) => {
    await prepare?.(tx);
    await releases.createDraftIn(tx, editor, version, notes);
    await releases.publishIn(tx, editor, version);
  });
}

/** A source row with only a citation (test data). Returns its id. */
export async function insertSource(t: TestApp, citation: string): Promise<number> {
  const { rows } = await t.db.pool.query(
    `insert into sources (csl, citation) values ('{}', $1) returning id`,
    [citation],
  );
  return rows[0].id as number;
}

/**
 * A new crystalline species with one accepted ΔfH° of −123.4567 ± 0.8 kJ/mol (expanded, k = 2;
 * test data), written straight into the registry tables as if its proposal had been accepted.
 * Returns the revision's id.
 */
export async function insertAcceptedSpecies(
  t: TestApp,
  species: { key: string; name: string; formula: string; method: string; sourceId: number },
): Promise<number> {
  const one = async (text: string, params: unknown[]) =>
    (await t.db.pool.query(text, params)).rows[0].id as number;
  const speciesId = await one(
    `insert into species (key, name, formula) values ($1, $2, $3) returning id`,
    [species.key, species.name, species.formula],
  );
  const phaseId = await one(
    `insert into species_phases (species_id, phase) values ($1, 'cr') returning id`,
    [speciesId],
  );
  return one(
    `insert into revisions (species_phase_id, kind, quantity, value, uncertainty,
       uncertainty_basis, method, source_id, status)
     values ($1, 'formation_enthalpy', 'formation_enthalpy', -123456.7, 800, 'expanded_k2',
             $2, $3, 'accepted') returning id`,
    [phaseId, species.method, species.sourceId],
  );
}
