import { sql } from 'drizzle-orm';
import type { Database } from '../src/db/client';

/**
 * A synthetic registry at the size the registry must stay fast at: 20,000 species-phases
 * (16,000 species, 4,000 of them also liquid), 200,000 ΔfH° revisions (ten per species-phase,
 * the newest accepted), 2,000 NASA heat-capacity sets, and 50 published releases each pinning one
 * revision per species-phase and quantity (1,000,000 entries). Names and numbers are invented.
 */
export const SYNTHETIC = {
  species: 16_000,
  liquids: 4_000,
  revisionsPerPhase: 10,
  heatCapacitySets: 2_000,
  releases: 50,
} as const;

export const releaseVersion = (n: number) => `2030.${n}`;

const SYLLABLES = [
  'kes',
  'trel',
  'an',
  'ox',
  'yl',
  'meth',
  'eth',
  'prop',
  'but',
  'ol',
  'one',
  'ene',
  'ic',
  'ar',
  'ben',
  'zo',
  'cy',
  'clo',
  'hex',
  'pent',
  'am',
  'ide',
  'ite',
  'ate',
];

/** Small seeded generator so every run builds the same registry. */
function rng(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export interface SyntheticSpecies {
  key: string;
  name: string;
  formula: string;
}

export function syntheticSpecies(count: number, seed = 7): SyntheticSpecies[] {
  const r = rng(seed);
  const pick = <T>(list: readonly T[]) => list[Math.floor(r() * list.length)]!;
  const out: SyntheticSpecies[] = [];
  for (let i = 0; i < count; i++) {
    const word = Array.from({ length: 2 + Math.floor(r() * 3) }, () => pick(SYLLABLES)).join('');
    const c = 1 + Math.floor(r() * 14);
    const h = 2 + Math.floor(r() * 2 * c);
    const o = Math.floor(r() * 4);
    const n = Math.floor(r() * 2);
    const formula = `C${c > 1 ? c : ''}H${h}${n ? 'N' : ''}${o ? `O${o > 1 ? o : ''}` : ''}`;
    out.push({
      key: `${word}-${i}`,
      name: `${word[0]!.toUpperCase()}${word.slice(1)} ${i}`,
      formula,
    });
  }
  return out;
}

/** Fills an empty, migrated database. Triggers are skipped during the bulk load (replica mode). */
export async function generateRegistry(db: Database): Promise<void> {
  const list = syntheticSpecies(SYNTHETIC.species);
  await db.transaction(async (tx) => {
    await tx.execute(sql`set local session_replication_role = replica`);
    await tx.execute(sql`insert into users (github_id, login, name, role)
      values (0, 'bench-system', 'Bench', 'editor')`);
    await tx.execute(sql`insert into sources (key, csl, citation)
      select 'bench-source-' || g, '{}'::jsonb, 'Kestrel Process Works synthetic source ' || g
      from generate_series(1, 500) g`);
    await tx.execute(sql`insert into species (key, name, formula, synonyms)
      select key, name, formula, array[name || ' (synthetic)']
      from jsonb_to_recordset(${JSON.stringify(list)}::jsonb) as t(key text, name text, formula text)`);
    await tx.execute(sql`insert into species_phases (species_id, phase)
      select id, 'g'::phase from species
      union all
      select id, 'l'::phase from species where id <= ${SYNTHETIC.liquids}`);
    await tx.execute(sql`insert into revisions
        (species_phase_id, kind, quantity, value, uncertainty, uncertainty_basis, method,
         source_id, status, created_at)
      select sp.id, 'formation_enthalpy', 'formation_enthalpy',
             round((-500000 + (sp.id * 37 + v * 11) % 600000)::numeric, 1), 400 + v,
             'expanded_k2', 'evaluated', 1 + (sp.id + v) % 500,
             case when v = ${SYNTHETIC.revisionsPerPhase} then 'accepted' else 'superseded' end::revision_status,
             now() - make_interval(days => 10 * (${SYNTHETIC.revisionsPerPhase} - v))
      from species_phases sp, generate_series(1, ${SYNTHETIC.revisionsPerPhase}) v`);
    await tx.execute(sql`insert into revisions
        (species_phase_id, kind, quantity, heat_capacity_form, source_id, status)
      select id, 'heat_capacity', 'heat_capacity', 'nasa7', 1, 'accepted'
      from species_phases where phase = 'g' order by id limit ${SYNTHETIC.heatCapacitySets}`);
    await tx.execute(sql`insert into heat_capacity_ranges (revision_id, seq, t_min, t_max, coefficients)
      select r.id, s.seq, case s.seq when 0 then 200 else 1000 end, case s.seq when 0 then 1000 else 6000 end,
             array[3.5, 0.001, -1e-7, 1e-10, -1e-14, -30000, 3]::numeric[]
      from revisions r, (values (0), (1)) s(seq) where r.kind = 'heat_capacity'`);
    await tx.execute(sql`insert into releases (version, notes, status, published_by, published_at)
      select '2030.' || n, 'synthetic', 'published', (select id from users where github_id = 0),
             now() - make_interval(days => 60 - n)
      from generate_series(1, ${SYNTHETIC.releases}) n`);
    // Release n pins the revision that was current then: ΔfH° revision ceil(n / 5) of ten.
    await tx.execute(sql`insert into release_entries (release_id, species_phase_id, quantity, revision_id)
      select rel.id, r.species_phase_id, r.quantity, r.id
      from releases rel
      join lateral (
        select id, species_phase_id, quantity,
               row_number() over (partition by species_phase_id order by id) as nth
        from revisions where kind = 'formation_enthalpy'
      ) r on r.nth = least(${SYNTHETIC.revisionsPerPhase}, ceil(split_part(rel.version, '.', 2)::int / 5.0))`);
    await tx.execute(sql`insert into release_entries (release_id, species_phase_id, quantity, revision_id)
      select rel.id, r.species_phase_id, r.quantity, r.id
      from releases rel, revisions r where r.kind = 'heat_capacity'`);
  });
  await db.execute(sql`analyze`);
}
