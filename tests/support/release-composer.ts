import request from 'supertest';
import { acceptFormationValueIn } from '../../server/src/db/accepted-revisions';
import { DraftAnswer } from '../../server/src/modules/releases/release-drafts-schemas';
import { signIn, type TestApp } from './test-app';

/** The calls the release-composer tests make. */
export type ReleaseComposer = Awaited<ReturnType<typeof releaseComposer>>;

/**
 * Signs both demo editors in and returns them with the queries and release calls the
 * release-composer tests share. Drafts are created and published as demo-editor unless an
 * agent is given.
 */
export async function releaseComposer(t: TestApp) {
  const editor = request.agent(t.app);
  const editorXsrf = await signIn(editor, 'demo-editor');
  const editor2 = request.agent(t.app);
  const editor2Xsrf = await signIn(editor2, 'demo-editor-2');

  const one = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows[0];
  const rows = async (text: string, params: unknown[] = []) =>
    (await t.db.pool.query(text, params)).rows;

  const userId = async (login: string) =>
    (await one(`select id from users where login = $1`, [login])).id as number;
  const phaseId = async (key: string, phase: string) =>
    (
      await one(
        `select sp.id from species_phases sp join species s on s.id = sp.species_id
         where s.key = $1 and sp.phase = $2 and sp.modification is null`,
        [key, phase],
      )
    ).id as number;
  const acceptedId = async (key: string, phase: string) =>
    (
      await one(
        `select r.id from revisions r where r.species_phase_id = $1
         and r.quantity = 'formation_enthalpy' and r.status = 'accepted'`,
        [await phaseId(key, phase)],
      )
    ).id as number;
  const sourceId = async () => (await one(`select min(id) as id from sources`)).id as number;

  /** Accepts a new ΔfH° the way an approval does (the old accepted revision is superseded). */
  const accept = async (
    key: string,
    phase: string,
    value: string,
    extra: { uncertainty?: string; inputs?: number[] } = {},
  ) =>
    t.db.db.transaction(async (tx) =>
      acceptFormationValueIn(tx, {
        speciesPhaseId: await phaseId(key, phase),
        value,
        uncertainty: extra.uncertainty ?? '100',
        method: extra.inputs ? 'derived' : 'combustion_calorimetry',
        sourceId: await sourceId(),
        notes: 'test value',
        createdBy: await userId('demo-editor'),
        inputRevisionIds: extra.inputs,
        derivation: extra.inputs
          ? { equation: 'test', deltaH: '0', uncertainty: null, releaseVersion: 'test' }
          : undefined,
      }),
    );

  /** Leaves every change of a draft out, so a test starts from a known change set. */
  const excludeAll = async (version: string) => {
    const d = DraftAnswer.parse((await editor.get(`/api/v1/releases/${version}/changes`)).body);
    const ids = d.changes.filter((c) => c.included).map((c) => c.revisionId);
    if (ids.length === 0) return;
    await editor
      .patch(`/api/v1/releases/${version}`)
      .set('X-XSRF-TOKEN', editorXsrf)
      .send({ exclude: ids })
      .expect(200);
  };
  const create = (version: string, notes = '', agent = editor, xsrf = editorXsrf) =>
    agent.post('/api/v1/releases').set('X-XSRF-TOKEN', xsrf).send({ version, notes });
  const publish = (version: string, agent = editor, xsrf = editorXsrf) =>
    agent.post(`/api/v1/releases/${version}/publish`).set('X-XSRF-TOKEN', xsrf);
  /** The newest published release's version. */
  const latest = async () =>
    (
      await one(`select version from releases where status = 'published'
      order by published_at desc, id desc limit 1`)
    ).version as string;

  return {
    editor,
    editorXsrf,
    editor2,
    editor2Xsrf,
    one,
    rows,
    userId,
    phaseId,
    acceptedId,
    sourceId,
    accept,
    excludeAll,
    create,
    publish,
    latest,
  };
}
