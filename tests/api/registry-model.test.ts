import { readDataset } from '../../imports/registry-csv';
import { pgErrorCode } from '../../server/src/db/client';
import {
  ensureStarterRelease,
  loadStarterDataset,
  STARTER_DIR,
} from '../../server/src/db/load-starter';
import { createReleasesService } from '../../server/src/modules/releases/releases-service';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

describe('registry model and the starter load', () => {
  let db: TestDatabase;
  const dataset = readDataset(STARTER_DIR);
  beforeAll(async () => {
    db = await createTestDatabase();
  });
  afterAll(() => db.drop());

  const q = async (text: string, params: unknown[] = []) =>
    (await db.pool.query(text, params)).rows;
  const counts = async () =>
    (
      await q(`select (select count(*) from species)::int as species,
                      (select count(*) from species_phases)::int as phases,
                      (select count(*) from sources)::int as sources,
                      (select count(*) from revisions)::int as revisions,
                      (select count(*) from heat_capacity_ranges)::int as ranges,
                      (select count(*) from release_entries)::int as entries,
                      (select count(*) from releases)::int as releases,
                      (select count(*) from audit_log)::int as audit`)
    )[0];

  /** The SQLSTATE a statement fails with, run in a transaction that is rolled back. */
  async function failure(text: string, params: unknown[] = []): Promise<string | undefined> {
    const client = await db.pool.connect();
    try {
      await client.query('begin');
      await client.query(text, params);
      return undefined;
    } catch (err) {
      return pgErrorCode(err);
    } finally {
      await client.query('rollback');
      client.release();
    }
  }

  describe('the starter release as the test template loaded it', () => {
    it('holds every row of the data files, published as 2026.1 by the system account', async () => {
      // The demo data (proposals, demo sources) adds rows of its own: count the system's.
      const [c] = await q(
        `select (select count(*) from species where created_by = u.id)::int as species,
                (select count(*) from sources where key = any($1::text[]))::int as sources,
                (select count(*) from revisions where created_by = u.id)::int as revisions,
                (select count(*) from release_entries)::int as entries
         from users u where u.login = 'thalpos-system'`,
        [dataset.sources.map((x) => x.id)],
      );
      expect(c.species).toBe(dataset.species.length);
      expect(c.sources).toBe(dataset.sources.length);
      expect(c.revisions).toBe(
        dataset.formation.length + dataset.heatCapacity.length + dataset.transitions.length,
      );
      expect(c.entries).toBe(c.revisions);
      const [release] = await q(`select r.status, u.login from releases r
        join users u on u.id = r.published_by where r.version = '2026.1'`);
      expect(release).toEqual({ status: 'published', login: 'thalpos-system' });
      const audit = await q(`select action from audit_log a join users u on u.id = a.actor_id
        where u.login = 'thalpos-system' order by a.id`);
      expect(audit.map((a) => a.action)).toEqual(
        expect.arrayContaining([
          'registry.dataset_loaded',
          'release.draft_created',
          'release.published',
        ]),
      );
    });

    it('stores numbers exactly as decimal text (numeric, never float)', async () => {
      const [col] = await q(`select data_type from information_schema.columns
        where table_name = 'revisions' and column_name = 'value'`);
      expect(col.data_type).toBe('numeric');
      for (const f of dataset.formation.slice(0, 20)) {
        const [row] = await q(
          `select r.value::text from revisions r join species_phases sp on sp.id = r.species_phase_id
           join species s on s.id = sp.species_id
           where s.key = $1 and sp.phase = $2 and sp.modification is not distinct from $3
             and r.quantity = 'formation_enthalpy'`,
          [f.species, f.phase, f.modification],
        );
        expect(row.value).toBe(f.valueJPerMol);
      }
    });

    it('loads again as a no-op, also when two loaders race', async () => {
      const before = await counts();
      const results = await Promise.all([
        ensureStarterRelease(db.db),
        loadStarterDataset(db.db, createReleasesService(db.db)),
      ]);
      expect(results.map((r) => r.loaded)).toEqual([false, false]);
      expect(await counts()).toEqual(before);
    });
  });

  describe('constraints', () => {
    const waterGas = `(select sp.id from species_phases sp join species s on s.id = sp.species_id
                       where s.key = 'water' and sp.phase = 'g')`;
    const anySource = '(select min(id) from sources)';

    it.each([
      [
        'a key that is not lowercase words with hyphens',
        `insert into species (key, name, formula) values ('Water Two', 'x', 'H2O')`,
        '23514',
      ],
      [
        'a duplicate key',
        `insert into species (key, name, formula) values ('water', 'x', 'H2O')`,
        '23505',
      ],
      [
        'a malformed CAS RN',
        `insert into species (key, name, formula, cas_rn) values ('x-1', 'x', 'H2O', '7732185')`,
        '23514',
      ],
      [
        'a malformed InChIKey',
        `insert into species (key, name, formula, inchi_key) values ('x-2', 'x', 'H2O', 'nope')`,
        '23514',
      ],
      [
        'a second species-phase with no modification',
        `insert into species_phases (species_id, phase) select species_id, phase from species_phases where id = ${waterGas}`,
        '23505',
      ],
      [
        'an unknown phase',
        `insert into species_phases (species_id, phase) select id, 's' from species where key = 'water'`,
        '22P02',
      ],
      [
        'a DOI already held',
        `insert into sources (csl, citation, doi) values ('{}', 'x', '10.1000/abc'), ('{}', 'y', '10.1000/abc')`,
        '23505',
      ],
      [
        'an upper-case DOI',
        `insert into sources (csl, citation, doi) values ('{}', 'x', '10.1000/ABC')`,
        '23514',
      ],
      [
        'a ΔfH° revision without a value',
        `insert into revisions (species_phase_id, kind, quantity, source_id, status) values (${waterGas}, 'formation_enthalpy', 'formation_enthalpy', ${anySource}, 'proposed')`,
        '23514',
      ],
      [
        'an uncertainty without its basis',
        `insert into revisions (species_phase_id, kind, quantity, value, uncertainty, source_id, status) values (${waterGas}, 'formation_enthalpy', 'formation_enthalpy', 1, 2, ${anySource}, 'proposed')`,
        '23514',
      ],
      [
        'a transition whose quantity does not name its target phase',
        `insert into revisions (species_phase_id, kind, quantity, value, temperature, to_phase, source_id, status) values (${waterGas}, 'transition', 'transition:l', 1, 300, 'cr', ${anySource}, 'proposed')`,
        '23514',
      ],
      [
        'a second accepted value for one species-phase',
        `insert into revisions (species_phase_id, kind, quantity, value, source_id, status) values (${waterGas}, 'formation_enthalpy', 'formation_enthalpy', 1, ${anySource}, 'accepted')`,
        '23505',
      ],
      [
        'a release version that is not a label',
        `insert into releases (version) values ('latest')`,
        '23514',
      ],
      [
        'a published release without publisher',
        `insert into releases (version, status, published_at) values ('2030.1', 'published', now())`,
        '23514',
      ],
    ])('refuses %s', async (_what, statement, code) => {
      expect(await failure(statement)).toBe(code);
    });

    it('refuses a release entry that pins a revision of another species-phase', async () => {
      const code = await failure(`
        with d as (insert into releases (version) values ('2030.2') returning id)
        insert into release_entries (release_id, species_phase_id, quantity, revision_id)
        select d.id, ${waterGas}, 'formation_enthalpy',
               (select min(id) from revisions where species_phase_id <> ${waterGas}
                  and quantity = 'formation_enthalpy')
        from d`);
      expect(code).toBe('23503');
    });

    it('refuses two entries for one species-phase and quantity in a release', async () => {
      const code = await failure(`
        with d as (insert into releases (version) values ('2030.3') returning id),
             r as (select id, species_phase_id, quantity from revisions
                   where species_phase_id = ${waterGas} and quantity = 'formation_enthalpy')
        insert into release_entries (release_id, species_phase_id, quantity, revision_id)
        select d.id, r.species_phase_id, r.quantity, r.id from d, r
        union all select d.id, r.species_phase_id, r.quantity, r.id from d, r`);
      expect(code).toBe('23505');
    });

    it('has the indexes the read paths use', async () => {
      const names = (await q(`select indexname from pg_indexes where schemaname = 'public'`)).map(
        (r) => r.indexname,
      );
      expect(names).toEqual(
        expect.arrayContaining([
          'release_entries_release_id_species_phase_id_quantity_pk',
          'release_entries_revision_idx',
          'release_entries_species_phase_idx',
          'revisions_species_phase_idx',
          'revisions_one_accepted_idx',
          'species_formula_idx',
          'sources_doi_idx',
        ]),
      );
    });
  });
});
