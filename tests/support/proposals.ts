import request from 'supertest';
import { signIn, type Agent, type TestApp } from './test-app';

/** A signed-in demo account and the calls the proposal tests make with it. */
export interface Curator {
  login: string;
  agent: Agent;
  xsrf: string;
  post(path: string, body?: unknown): request.Test;
  put(path: string, body: unknown): request.Test;
  patch(path: string, body: unknown): request.Test;
  get(path: string): request.Test;
}

export async function as(t: TestApp, login: string): Promise<Curator> {
  const agent = request.agent(t.app);
  const xsrf = await signIn(agent, login);
  return {
    login,
    agent,
    xsrf,
    post: (path, body = {}) =>
      agent
        .post(path)
        .set('X-XSRF-TOKEN', xsrf)
        .send(body as object),
    put: (path, body) =>
      agent
        .put(path)
        .set('X-XSRF-TOKEN', xsrf)
        .send(body as object),
    patch: (path, body) =>
      agent
        .patch(path)
        .set('X-XSRF-TOKEN', xsrf)
        .send(body as object),
    get: (path) => agent.get(path),
  };
}

export const row = async (t: TestApp, text: string, params: unknown[] = []) =>
  (await t.db.pool.query(text, params)).rows[0];

/** The id of a starter source by its key, as the text the fixed contract sends. */
export const sourceId = async (t: TestApp, key = 'codata-1989'): Promise<string> =>
  String((await row(t, 'select id from sources where key = $1', [key])).id);

/** A ΔfH° value item of the fixed contract (issue 7). */
export function valueItem(
  source: string,
  over: Record<string, unknown> = {},
): Record<string, unknown> {
  return {
    kind: 'supersede_value',
    species: 'methane',
    phase: 'g',
    quantity: 'formation_enthalpy',
    value: -74.6,
    unit: 'kJ/mol',
    uncertainty: 0.3,
    uncertaintyBasis: 'expanded_k2',
    method: 'combustion_calorimetry',
    sourceId: source,
    ...over,
  };
}

/** Creates and submits a proposal; returns its id. */
export async function submitted(
  author: Curator,
  items: Record<string, unknown>[],
  rationale = 'Newer measurement',
): Promise<number> {
  const created = await author.post('/api/v1/proposals', { rationale, items }).expect(201);
  await author.post(`/api/v1/proposals/${created.body.id}/submit`).expect(200);
  return created.body.id as number;
}
