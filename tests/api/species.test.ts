import request from 'supertest';
import { readDataset } from '../../imports/registry-csv';
import { STARTER_DIR } from '../../server/src/db/load-starter';
import { ReleaseSpeciesPage, SpeciesPage } from '../../server/src/modules/species/species-schemas';
import { molarMass } from '../../server/src/thermo';
import { createTestApp, type TestApp } from '../support/test-app';

describe('species of a release and species pages', () => {
  let t: TestApp;
  const dataset = readDataset(STARTER_DIR);
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const list = async (query: string) =>
    ReleaseSpeciesPage.parse(
      (await request(t.app).get(`/api/v1/releases/2026.1/species?${query}`).expect(200)).body,
    );

  describe('GET /releases/:version/species', () => {
    it('pages through every ΔfH° of the release without overlap', async () => {
      const first = await list('pageSize=25&page=1');
      expect(first.total).toBe(dataset.formation.length);
      const seen = new Set<number>();
      for (let page = 1; (page - 1) * 25 < first.total; page++) {
        const p = await list(`pageSize=25&page=${page}`);
        expect(p.items.length).toBeLessThanOrEqual(25);
        for (const item of p.items) seen.add(item.revisionId);
      }
      expect(seen.size).toBe(first.total);
      expect((await list(`pageSize=25&page=${Math.ceil(first.total / 25) + 1}`)).items).toEqual([]);
    });

    it('carries the exact value, uncertainty and source of the data file', async () => {
      const p = await list('pageSize=200');
      for (const row of dataset.formation) {
        const item = p.items.find(
          (i) =>
            i.key === row.species && i.phase === row.phase && i.modification === row.modification,
        );
        expect(item).toBeDefined();
        expect(item!.deltaFHText).toBe(row.valueJPerMol);
        expect(item!.uncertainty).toBe(
          row.uncertaintyJPerMol === null ? null : Number(row.uncertaintyJPerMol),
        );
        expect(item!.fromMemory).toBe(row.fromMemory);
        expect(item!.source.citation.length).toBeGreaterThan(10);
      }
    });

    it('sorts by ΔfH°, by name, either way', async () => {
      const asc = (await list('sort=deltaFH&pageSize=200')).items.map((i) => i.deltaFH);
      expect(asc).toEqual([...asc].sort((a, b) => a - b));
      const desc = (await list('sort=name&order=desc&pageSize=200')).items.map((i) => i.name);
      expect(desc[0]!.localeCompare(desc[desc.length - 1]!)).toBeGreaterThanOrEqual(0);
    });

    it('filters by formula in any element order, by phase and by name', async () => {
      for (const spelling of ['H2O', 'OH2']) {
        const w = await list(`formula=${spelling}`);
        expect(w.formula).toBe('H2O');
        expect(w.items.map((i) => `${i.key}(${i.phase})`).sort()).toEqual(['water(g)', 'water(l)']);
      }
      const isomers = await list('formula=C4H10');
      expect(new Set(isomers.items.map((i) => i.key))).toEqual(
        new Set(['butane', '2-methylpropane']),
      );

      const aq = await list('phase=aq&pageSize=200');
      expect(aq.total).toBe(dataset.formation.filter((f) => f.phase === 'aq').length);
      expect(aq.items.every((i) => i.phase === 'aq')).toBe(true);
      const solids = await list('phase=s&pageSize=200');
      expect(solids.items.every((i) => i.phase === 'cr' || i.phase === 'am')).toBe(true);
      expect(solids.items.some((i) => i.modification === 'calcite')).toBe(true);

      const byName = await list('name=METHAN');
      expect(byName.items.map((i) => i.key)).toEqual(
        expect.arrayContaining(['methane', 'methanol']),
      );
      const literal = await list('name=%25');
      expect(literal.total).toBe(0);
    });

    it.each([
      ['pageSize=0', 'validation_error'],
      ['pageSize=201', 'validation_error'],
      ['page=-1', 'validation_error'],
      ['phase=plasma', 'validation_error'],
      ['colour=blue', 'validation_error'],
      ['formula=H2Q', undefined],
    ])('refuses %s with a 400', async (query, code) => {
      const res = await request(t.app).get(`/api/v1/releases/2026.1/species?${query}`).expect(400);
      expect(res.body.error.code).toBe(code ?? res.body.error.code);
      expect(typeof res.body.error.message).toBe('string');
    });

    it('works with latest and answers 404 unknown_release for an unknown one', async () => {
      const latest = await request(t.app).get('/api/v1/releases/latest/species').expect(200);
      expect(latest.body.release).toBe('2026.1');
      const res = await request(t.app).get('/api/v1/releases/1999.1/species').expect(404);
      expect(res.body.error.code).toBe('unknown_release');
    });
  });

  describe('GET /species/:key', () => {
    it('shows phases with their value in each release, history, sources and molar mass', async () => {
      const res = await request(t.app).get('/api/v1/species/water').expect(200);
      const page = SpeciesPage.parse(res.body);
      const row = dataset.species.find((s) => s.key === 'water')!;
      expect(page).toMatchObject({
        name: row.name,
        formula: row.hill,
        casRn: row.casRn,
        inchiKey: row.inchiKey,
        smiles: row.smiles,
      });
      expect(page.molarMass).toBeCloseTo(molarMass('H2O'), 10);
      for (const f of dataset.formation.filter((x) => x.species === 'water')) {
        const phase = page.phases.find((p) => p.phase === f.phase)!;
        expect(phase.formationEnthalpy).toEqual([
          expect.objectContaining({ release: '2026.1', value: Number(f.valueJPerMol) }),
        ]);
      }
      const transitions = page.revisions.filter((r) => r.kind === 'transition');
      expect(transitions.map((r) => r.temperature).sort()).toEqual(
        dataset.transitions
          .filter((x) => x.species === 'water')
          .map((x) => Number(x.temperatureK))
          .sort(),
      );
      expect(page.revisions.every((r) => r.releases.includes('2026.1'))).toBe(true);
      const sourceIds = new Set(page.revisions.map((r) => r.sourceId));
      expect(page.sources.map((s) => s.id).sort()).toEqual([...sourceIds].sort());
      expect(page.sources.every((s) => s.citation.length > 10)).toBe(true);
    });

    it('lists heat-capacity sets with their ranges', async () => {
      const set = dataset.heatCapacity[0]!;
      const page = SpeciesPage.parse(
        (await request(t.app).get(`/api/v1/species/${set.species}`).expect(200)).body,
      );
      const rev = page.revisions.find((r) => r.kind === 'heat_capacity' && r.phase === set.phase);
      expect(rev?.heatCapacity?.form).toBe(set.kind);
      expect(rev?.heatCapacity?.ranges.map((r) => [r.tMin, r.tMax])).toEqual(
        set.ranges.map((r) => [Number(r.tMinK), Number(r.tMaxK)]),
      );
    });

    it('hides proposals that were never accepted', async () => {
      await t.db.pool.query(`
        insert into revisions (species_phase_id, kind, quantity, value, method, source_id, status)
        select species_phase_id, kind, quantity, -1, 'estimated', source_id, 'proposed'
        from revisions r where r.quantity = 'formation_enthalpy'
          and r.species_phase_id = (select sp.id from species_phases sp join species s on s.id = sp.species_id
                                    where s.key = 'ammonia' and sp.phase = 'g')`);
      const page = SpeciesPage.parse(
        (await request(t.app).get('/api/v1/species/ammonia').expect(200)).body,
      );
      expect(page.revisions.some((r) => r.value === -1)).toBe(false);
    });

    it('answers 404 unknown_species for a key it does not hold', async () => {
      for (const key of ['unobtainium', 'WATER', '%27%20or%201=1']) {
        const res = await request(t.app).get(`/api/v1/species/${key}`).expect(404);
        expect(res.body.error.code).toBe('unknown_species');
      }
    });
  });
});
