import request from 'supertest';
import { WatchlistImpactAnswer } from '../../server/src/modules/proposals/proposals-schemas';
import { createTestApp, type TestApp } from '../support/test-app';
import { as, row, sourceId, submitted, valueItem, type Curator } from '../support/proposals';

/** The accepted ΔfH° of a species-phase, J/mol, as the registry stores it. */
const accepted = async (t: TestApp, key: string, phase: string): Promise<number> =>
  Number(
    (
      await row(
        t,
        `select r.value from revisions r join species_phases sp on sp.id = r.species_phase_id
         join species s on s.id = sp.species_id
         where s.key = $1 and sp.phase = $2 and r.quantity = 'formation_enthalpy'
           and r.status = 'accepted'`,
        [key, phase],
      )
    ).value,
  );

/** The reaction API's answer (the latest release, which the accepted values still equal). */
const reactionApi = (t: TestApp, equation: string, temperatureK: number) =>
  request(t.app)
    .get('/api/v1/reaction-enthalpy')
    .query({ equation, temperatureK: String(temperatureK), unit: 'kJ/mol' });

/** Combustion to steam; liquid water inside its Shomate range (273.15–373.15 K); past the data. */
const HOT = [
  { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', temperatureK: 500 },
  { equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', temperatureK: 350 },
  { equation: 'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(g)', temperatureK: 8000 },
];

describe('GET /api/v1/proposals/:id/watchlist-impact', () => {
  jest.setTimeout(120_000);
  let t: TestApp;
  let reader: Curator, curator: Curator, editor: Curator, editor2: Curator;
  let proposalId: number;
  let methaneDelta: number;
  let ownList: number, othersList: number, hotList: number;

  beforeAll(async () => {
    t = await createTestApp();
    [reader, curator, editor, editor2] = await Promise.all(
      ['demo-reader', 'demo-curator', 'demo-editor', 'demo-editor-2'].map((l) => as(t, l)),
    );
    const source = await sourceId(t);
    // Methane moves by a known amount; liquid water by 1 kJ/mol with a tight uncertainty.
    const methane = await accepted(t, 'methane', 'g');
    const water = await accepted(t, 'water', 'l');
    const proposedMethane = methane + 1234.5;
    methaneDelta = proposedMethane - methane;
    proposalId = await submitted(curator, [
      valueItem(source, { value: proposedMethane, unit: 'J/mol', uncertainty: 300 }),
      valueItem(source, {
        species: 'water',
        phase: 'l',
        value: water + 1000,
        unit: 'J/mol',
        uncertainty: 40,
      }),
    ]);
    const save = async (who: Curator, name: string, equations: string[], temperatureK?: number[]) =>
      (
        await who
          .post('/api/v1/me/watchlists', {
            name,
            reactions: equations.map((equation, i) => ({
              equation,
              ...(temperatureK ? { temperatureK: temperatureK[i] } : {}),
            })),
          })
          .expect(201)
      ).body.watchlist.id as number;
    ownList = await save(editor, 'Burner duties', [
      'CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)',
      'C(graphite) + O2(g) -> CO2(g)',
      'H2(g) + 1/2 O2(g) -> H2O(l)',
      'Xx2(g) -> Xx2(l)',
    ]);
    othersList = await save(editor2, 'Someone else', ['CH4(g) + 2 O2(g) -> CO2(g) + 2 H2O(l)']);
    // Away from 298.15 K: every species here has a heat-capacity set in the starter data.
    hotList = await save(
      editor,
      'Kiln duties',
      [...HOT.map((r) => r.equation)],
      [...HOT.map((r) => r.temperatureK)],
    );
  });
  afterAll(() => t.close());

  const path = (id = proposalId) => `/api/v1/proposals/${id}/watchlist-impact`;

  it("gives each of the caller's watchlists before and with the proposal, the change exactly ν × Δ", async () => {
    const answer = WatchlistImpactAnswer.parse((await editor.get(path()).expect(200)).body);
    expect(answer).toMatchObject({ proposalId, status: 'submitted' });
    expect(answer.caution).toMatch(/caution|engineer/i);
    expect(answer.watchlists.map((w) => w.id)).toEqual([ownList, hotList]);
    const [list] = answer.watchlists;
    expect(list!.report).toMatchObject({ unit: 'kJ/mol', from: 'accepted', count: 4, errors: 1 });
    const [combustion, co2, water, unknown] = list!.report.results;
    // CH4 is a reactant (ν = −1): ΔrH moves by −Δ; the product water (ν = 2) by 2 × 1 kJ/mol.
    expect(combustion!.change).toBeCloseTo(-methaneDelta / 1000 + 2, 9);
    expect(co2!.change).toBe(0);
    expect(water!.change).toBeCloseTo(1, 9);
    // ±40 J/mol on both sides (the starter value and the proposed one).
    expect(water!.combinedUncertainty).toBeCloseTo(Math.hypot(0.04, 0.04), 9);
    expect(water!.exceedsUncertainty).toBe(true);
    // Each side is what the engine answers for the accepted values.
    const single = await request(t.app)
      .post('/api/v1/reaction-enthalpy')
      .send({ equation: 'H2(g) + 1/2 O2(g) -> H2O(l)', unit: 'kJ/mol' })
      .expect(200);
    expect(water!.from).toMatchObject({ deltaH: single.body.deltaH });
    expect('error' in unknown!.from && unknown!.from.error.code).toBeTruthy();
    expect(unknown!.change).toBeNull();
    expect(list!.affected).toBe(2);
  });

  it('computes reactions at other temperatures through the heat-capacity data, as the reaction API does', async () => {
    const answer = WatchlistImpactAnswer.parse((await editor.get(path()).expect(200)).body);
    const hot = answer.watchlists.find((w) => w.id === hotList)!;
    expect(hot.report).toMatchObject({ count: 3, errors: 1 });
    const [steam, liquid, tooHot] = hot.report.results;
    expect([steam, liquid, tooHot].map((r) => r!.temperatureK)).toEqual([500, 350, 8000]);
    // Before: the reaction API's answer for the same equation and temperature; after: moved by
    // ν × the proposal's ΔfH° change (methane ν = −1; liquid water ν = 1, +1 kJ/mol).
    for (const [r, nuDelta] of [
      [steam!, -methaneDelta / 1000],
      [liquid!, 1],
    ] as const) {
      const api = (await reactionApi(t, r.input, r.temperatureK).expect(200)).body;
      expect(api.temperatureK).toBe(r.temperatureK);
      expect(r.from).toMatchObject({ deltaH: api.deltaH });
      expect('deltaH' in r.to && r.to.deltaH).toBeCloseTo(api.deltaH + nuDelta, 9);
      expect(r.change).toBeCloseTo(nuDelta, 9);
    }
    // The temperature differs from 298.15 K enough to move ΔrH: Kirchhoff's law was applied.
    const standard = (await reactionApi(t, steam!.input, 298.15).expect(200)).body;
    expect(
      Math.abs(standard.deltaH - ('deltaH' in steam!.from ? steam!.from.deltaH : NaN)),
    ).toBeGreaterThan(1);
    // Past the data's range: the reaction API's coded error, on both sides.
    const refused = await reactionApi(t, tooHot!.input, tooHot!.temperatureK).expect(422);
    expect(refused.body.error.code).toBe('out_of_range');
    for (const side of [tooHot!.from, tooHot!.to]) {
      expect('error' in side && side.error.code).toBe(refused.body.error.code);
    }
    expect(tooHot!.change).toBeNull();
    expect(hot.affected).toBe(2);
  });

  it("applies the proposal's own heat-capacity set: narrower data refuses 500 K with it", async () => {
    const source = await sourceId(t);
    // Demo data — not a real measurement: a methane set that stops at 400 K.
    const narrow = await submitted(curator, [
      {
        kind: 'supersede_value',
        species: 'methane',
        phase: 'g',
        quantity: 'heat_capacity',
        form: 'shomate',
        ranges: [{ tMin: 298, tMax: 400, coefficients: [-0.703, 108.48, -42.52, 5.86, 0.679] }],
        sourceId: source,
      },
    ]);
    const answer = WatchlistImpactAnswer.parse((await editor.get(path(narrow)).expect(200)).body);
    const hot = answer.watchlists.find((w) => w.id === hotList)!;
    const [steam, liquid] = hot.report.results;
    expect('deltaH' in steam!.from).toBe(true);
    expect('error' in steam!.to && steam!.to.error.code).toBe('out_of_range');
    expect(steam!.change).toBeNull();
    expect(liquid!.change).toBe(0);
    expect(hot.affected).toBe(1);
    // At 298.15 K heat capacities play no part: the other list does not move.
    expect(answer.watchlists.find((w) => w.id === ownList)!.affected).toBe(0);
  });

  it('moves methane combustion by exactly −Δ when only methane changes', async () => {
    const source = await sourceId(t);
    const methane = await accepted(t, 'methane', 'g');
    const only = await submitted(curator, [
      valueItem(source, { value: methane - 2500, unit: 'J/mol', uncertainty: 300 }),
    ]);
    const answer = WatchlistImpactAnswer.parse((await editor.get(path(only)).expect(200)).body);
    const [combustion, co2] = answer.watchlists[0]!.report.results;
    expect(combustion!.change).toBe(2.5);
    expect(co2!.change).toBe(0);
    expect(answer.watchlists[0]!.affected).toBe(1);
  });

  it("never shows another user's watchlists; the author sees only their own (none)", async () => {
    const mine = WatchlistImpactAnswer.parse((await editor2.get(path()).expect(200)).body);
    expect(mine.watchlists.map((w) => w.id)).toEqual([othersList]);
    const author = WatchlistImpactAnswer.parse((await curator.get(path()).expect(200)).body);
    expect(author.watchlists).toEqual([]);
  });

  it('refuses readers (403), anonymous callers (401) and unknown proposals (404)', async () => {
    expect((await reader.get(path()).expect(403)).body.error.code).toBe('forbidden');
    expect((await request(t.app).get(path()).expect(401)).body.error).toBeDefined();
    await editor.get(path(999_999)).expect(404);
    await editor.get('/api/v1/proposals/x/watchlist-impact').expect(400);
  });
});
