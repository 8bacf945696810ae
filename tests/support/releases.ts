import { sql } from 'drizzle-orm';
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
  const editor = (await t.db.pool.query(`select id from users where login = 'demo-editor'`))
    .rows[0] as { id: number };
  const releases = createReleasesService(t.db.db);
  await t.db.db.transaction(async (tx) => {
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
    await releases.createDraftIn(tx, editor, '2026.2', notes);
    await releases.publishIn(tx, editor, '2026.2');
  });
}
