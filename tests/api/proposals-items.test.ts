import { CheckAnswer, ProposalDetail } from '../../server/src/modules/proposals/proposals-schemas';
import { SpeciesPage } from '../../server/src/modules/species/species-schemas';
import { createTestApp, type TestApp } from '../support/test-app';
import { as, row, sourceId, submitted, valueItem, type Curator } from '../support/proposals';

describe('proposals: item kinds and validation', () => {
  // Many HTTP round trips per test: a busy machine makes them slower, never red.
  jest.setTimeout(120_000);
  let t: TestApp;
  let reader: Curator, curator: Curator, editor: Curator;
  let source: string;
  beforeAll(async () => {
    t = await createTestApp();
    [reader, curator, editor] = await Promise.all(
      ['demo-reader', 'demo-curator', 'demo-editor'].map((l) => as(t, l)),
    );
    source = await sourceId(t);
  });
  afterAll(() => t.close());

  const check = async (items: unknown[]) =>
    CheckAnswer.parse((await curator.post('/api/v1/proposals/check', { items }).expect(200)).body);
  const codes = (a: CheckAnswer) => a.issues.map((i) => [i.path, i.code]);

  const newSpecies = (over: Record<string, unknown> = {}) => ({
    kind: 'add_species',
    key: 'kestrelane',
    name: 'Kestrelane',
    formula: 'C7H16',
    phases: [{ phase: 'l' }],
    ...over,
  });

  it('answers 400 validation_error for a malformed body, naming the field', async () => {
    const cases: [unknown, string][] = [
      [{ items: [valueItem(source)] }, 'rationale'],
      [{ rationale: 'x', items: [] }, 'items'],
      [{ rationale: 'x', items: [valueItem(source, { unit: 'kcal' })] }, 'items[0].unit'],
      [{ rationale: 'x', items: [valueItem(source, { uncertainty: -1 })] }, 'items[0].uncertainty'],
      [{ rationale: 'x', items: [{ kind: 'teleport' }] }, 'items[0].kind'],
    ];
    for (const [body, field] of cases) {
      const res = await curator.post('/api/v1/proposals', body).expect(400);
      expect(res.body.error.code).toBe('validation_error');
      expect(JSON.stringify(res.body.error)).toContain(field.split('.')[0]!);
    }
  });

  it('answers 422 invalid_items with row-level issues, and writes nothing', async () => {
    const before = await row(t, 'select count(*)::int as n from proposals');
    const res = await curator
      .post('/api/v1/proposals', {
        rationale: 'bad items',
        items: [
          valueItem(source, { species: 'unobtainium' }),
          valueItem(source, { kind: 'add_value' }),
          valueItem(source, { species: 'water', phase: 'aq' }),
          valueItem(source, { species: 'ethane', sourceId: '999999' }),
        ],
      })
      .expect(422);
    expect(res.body.error.code).toBe('invalid_items');
    expect(
      res.body.error.issues.map((i: { path: string; code: string }) => [i.path, i.code]),
    ).toEqual([
      ['items[0].species', 'unknown_species'],
      ['items[1].kind', 'value_exists'],
      ['items[2].kind', 'no_current_value'],
      ['items[3].sourceId', 'unknown_source'],
    ]);
    expect((await row(t, 'select count(*)::int as n from proposals')).n).toBe(before.n);
  });

  it('checks a new species: key, formula, charge, CAS RN check digit and InChIKey shape', async () => {
    const a = await check([
      newSpecies({ key: 'Bad Key', formula: 'C7H16Xq', casRn: '142-82-4', inchiKey: 'abc' }),
      newSpecies({ key: 'kestrel-ion', formula: 'SO4^2-', charge: -1 }),
      newSpecies({ key: 'water' }),
    ]);
    expect(codes(a)).toEqual([
      ['items[0].key', 'invalid_key'],
      ['items[0].formula', 'invalid_formula'],
      ['items[0].casRn', 'invalid_cas'],
      ['items[0].inchiKey', 'invalid_inchikey'],
      ['items[1].charge', 'charge_mismatch'],
      ['items[2].key', 'key_taken'],
    ]);
    // 142-82-5 is n-heptane's CAS RN with its valid check digit.
    expect((await check([newSpecies({ casRn: '142-82-5' })])).ok).toBe(true);
  });

  it('warns about a likely duplicate (same Hill formula and name, or same CAS RN / InChIKey) without refusing it', async () => {
    const water = await row(t, `select cas_rn, inchi_key from species where key = 'water'`);
    const a = await check([
      newSpecies({ key: 'methane-again', name: 'Methane', formula: 'CH4', phases: [] }),
      newSpecies({
        key: 'dihydrogen-monoxide',
        name: 'Dihydrogen monoxide',
        formula: 'H2O',
        casRn: water.cas_rn,
      }),
      newSpecies({
        key: 'water-by-inchikey',
        name: 'Oxidane',
        formula: 'OH2',
        inchiKey: water.inchi_key,
      }),
    ]);
    expect(a.ok).toBe(true);
    expect(a.warnings.map((w) => [w.index, w.path, w.code, w.species])).toEqual([
      [0, 'items[0].name', 'likely_duplicate', 'methane'],
      [1, 'items[1].casRn', 'likely_duplicate', 'water'],
      [2, 'items[2].inchiKey', 'likely_duplicate', 'water'],
    ]);
    const created = await curator
      .post('/api/v1/proposals', {
        rationale: 'dup?',
        items: [newSpecies({ key: 'methane-again', name: 'Methane', formula: 'CH4' })],
      })
      .expect(201);
    expect(created.body.warnings).toHaveLength(1);
    const detail = ProposalDetail.parse(
      (await curator.get(`/api/v1/proposals/${created.body.id}`).expect(200)).body,
    );
    expect(detail.warnings[0]).toMatchObject({ code: 'likely_duplicate', species: 'methane' });
  });

  it('adds a species with a ΔfH°, a Shomate set and a transition in one proposal, accepted on approval', async () => {
    const items = [
      newSpecies({ casRn: '142-82-5', synonyms: ['heptane (demo key)'] }),
      { kind: 'add_phase', species: 'kestrelane', phase: 'g' },
      valueItem(source, {
        kind: 'add_value',
        species: 'kestrelane',
        phase: 'l',
        value: -224.4,
        uncertainty: 0.8,
      }),
      {
        kind: 'add_value',
        species: 'kestrelane',
        phase: 'g',
        quantity: 'heat_capacity',
        form: 'shomate',
        ranges: [{ tMin: 298, tMax: 1000, coefficients: [10, 500, -200, 30, -0.1] }],
        sourceId: source,
      },
      {
        kind: 'add_value',
        species: 'kestrelane',
        phase: 'l',
        quantity: 'transition',
        toPhase: 'g',
        temperature: 371.5,
        value: 31.8,
        unit: 'kJ/mol',
        method: 'calorimetry',
        sourceId: source,
      },
    ];
    const id = await submitted(curator, items, 'Demo data — not a real measurement: a new species');
    const detail = ProposalDetail.parse(
      (await editor.get(`/api/v1/proposals/${id}`).expect(200)).body,
    );
    const formation = detail.items[2]!;
    expect(formation.target).toBeNull();
    expect(formation.reactions.map((r) => [r.label, r.before, r.after !== null])).toEqual([
      ['formation', null, true],
      ['combustion', null, true],
    ]);
    expect(formation.reactions[0]!.after).toBeCloseTo(-224.4, 9);
    const res = await editor
      .post(`/api/v1/proposals/${id}/decision`, { decision: 'approve', comment: 'ok' })
      .expect(200);
    expect(res.body.createdRevisionIds).toHaveLength(3);
    const page = SpeciesPage.parse(
      (await reader.get('/api/v1/species/kestrelane').expect(200)).body,
    );
    expect(page).toMatchObject({ formula: 'C7H16', casRn: '142-82-5' });
    expect(page.revisions.map((r) => [r.kind, r.phase, r.status]).sort()).toEqual([
      ['formation_enthalpy', 'l', 'accepted'],
      ['heat_capacity', 'g', 'accepted'],
      ['transition', 'l', 'accepted'],
    ]);
    expect(page.revisions.find((r) => r.kind === 'transition')).toMatchObject({
      value: 31800,
      temperature: 371.5,
      toPhase: 'g',
    });
  });

  it('checks heat-capacity sets: NASA needs two meeting ranges of seven coefficients', async () => {
    const nasa = (ranges: unknown) => ({
      kind: 'supersede_value',
      species: 'methane',
      phase: 'g',
      quantity: 'heat_capacity',
      form: 'nasa7',
      ranges,
      sourceId: source,
    });
    const a7 = [5, 0, 0, 0, 0, -1000, 1];
    const one = await check([nasa([{ tMin: 200, tMax: 1000, coefficients: a7 }])]);
    expect(codes(one)).toEqual([['items[0].ranges', 'invalid_heat_capacity']]);
    const gap = await check([
      nasa([
        { tMin: 200, tMax: 1000, coefficients: a7 },
        { tMin: 1100, tMax: 3000, coefficients: a7 },
      ]),
    ]);
    expect(codes(gap)).toEqual([['items[0].ranges[1].tMin', 'invalid_heat_capacity']]);
  });

  it('retires the accepted value on approval; a second retirement is refused as stale', async () => {
    const item = {
      kind: 'retire_value',
      species: 'ozone',
      phase: 'g',
      quantity: 'formation_enthalpy',
      sourceId: source,
    };
    const first = await submitted(curator, [item]);
    const second = await submitted(curator, [item]);
    const target = (
      await row(t, 'select target_revision_id as id from proposal_items where proposal_id = $1', [
        first,
      ])
    ).id;
    await editor
      .post(`/api/v1/proposals/${first}/decision`, { decision: 'approve', comment: 'ok' })
      .expect(200);
    expect((await row(t, 'select status from revisions where id = $1', [target])).status).toBe(
      'retired',
    );
    const res = await editor
      .post(`/api/v1/proposals/${second}/decision`, { decision: 'approve', comment: 'ok' })
      .expect(409);
    expect(res.body.error).toMatchObject({ code: 'stale' });
    expect(res.body.error.message).toContain('was retired');
  });

  it('shows each value beside the one it replaces: difference, combined uncertainty, flag above 2, history and source', async () => {
    // Current ammonia(g): −45.94 ± 0.35 kJ/mol (CODATA Key Values); the proposed numbers are invented.
    const near = valueItem(source, { species: 'ammonia', value: -46.6, uncertainty: 0.3 });
    const far = valueItem(source, { species: 'ammonia', value: -47.5, uncertainty: 0.3 });
    const [a, b] = await Promise.all(
      [near, far].map(async (item) => {
        const res = await curator
          .post('/api/v1/proposals', { rationale: 'compare', items: [item] })
          .expect(201);
        return ProposalDetail.parse(
          (await curator.get(`/api/v1/proposals/${res.body.id}`).expect(200)).body,
        ).items[0]!;
      }),
    );
    const combined = Math.hypot(0.3, 0.35);
    expect(a!.comparison!.differenceKJPerMol).toBeCloseTo(-0.66, 9);
    expect(a!.comparison!.combinedUncertaintyKJPerMol).toBeCloseTo(combined, 9);
    expect(a!.comparison!.differenceInUncertainties).toBeCloseTo(0.66 / combined, 9);
    expect(a!.comparison!.flagged).toBe(false);
    expect(b!.comparison!.flagged).toBe(true);
    expect(a!.target).toMatchObject({ status: 'accepted', value: -45940, releases: ['2026.1'] });
    expect(a!.target!.source.citation).toMatch(/CODATA/);
    expect(a!.source?.id).toBe(Number(source));
    expect(a!.reactions.find((r) => r.label === 'formation')).toMatchObject({
      equation: '3/2 H2(g) + 1/2 N2(g) -> H3N(g)',
      before: -45.94,
      after: -46.6,
    });
  });

  it('lets curators use the check route; readers are refused', async () => {
    await reader.post('/api/v1/proposals/check', { items: [valueItem(source)] }).expect(403);
    expect((await check([valueItem(source)])).ok).toBe(true);
  });
});
