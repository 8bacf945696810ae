import request from 'supertest';
import { z } from 'zod';
import { openApiPath, registeredRoutes, routeKey } from '../../server/src/modules/docs/openapi';
import { ROUTE_DOCS } from '../../server/src/modules/docs/route-docs';
import { SAFETY_CAUTION } from '../../server/src/modules/reactions/reaction-answer';
import { createTestApp, type TestApp } from '../support/test-app';

interface Operation {
  summary: string;
  parameters: { name: string; in: string; example?: string }[];
  requestBody?: { content: Record<string, { example?: unknown; schema?: object }> };
  responses: Record<string, unknown>;
  security?: unknown[];
}
type OpenApi = {
  openapi: string;
  info: { title: string; description: string };
  paths: Record<string, Record<string, Operation>>;
};

describe('API reference', () => {
  let t: TestApp;
  let doc: OpenApi;
  beforeAll(async () => {
    t = await createTestApp();
    doc = (await request(t.app).get('/api/v1/openapi.json').expect(200)).body as OpenApi;
  });
  afterAll(() => t.close());

  it('is OpenAPI 3.1 and carries the safety caution', () => {
    expect(doc.openapi).toBe('3.1.0');
    expect(doc.info.title).toBe('Thalpos API');
    expect(doc.info.description).toContain(SAFETY_CAUTION);
  });

  it('documents every route the app registers, and nothing it does not', () => {
    const served = registeredRoutes(t.app).map(routeKey);
    expect(served.length).toBeGreaterThan(50);
    const undocumented = served.filter((k) => !ROUTE_DOCS[k]);
    expect(undocumented).toEqual([]);
    const stale = Object.keys(ROUTE_DOCS).filter((k) => !served.includes(k));
    expect(stale).toEqual([]);
    for (const route of registeredRoutes(t.app)) {
      const op = doc.paths[openApiPath(route.path)]?.[route.method.toLowerCase()];
      expect({ route: routeKey(route), summary: op?.summary }).toEqual({
        route: routeKey(route),
        summary: ROUTE_DOCS[routeKey(route)]!.summary,
      });
    }
  });

  it('takes request parameters and bodies from the contracts the routes validate with', () => {
    const reaction = doc.paths['/api/v1/reaction-enthalpy']!;
    expect(reaction['get']!.parameters.map((p) => p.name)).toEqual(
      expect.arrayContaining(['equation', 'release', 'temperatureK', 'unit']),
    );
    const body = reaction['post']!.requestBody!.content['application/json']!.schema as {
      properties: Record<string, unknown>;
      required: string[];
    };
    expect(Object.keys(body.properties)).toEqual(
      expect.arrayContaining(['equation', 'release', 'temperatureK', 'unit']),
    );
    expect(body.required).toContain('equation');
    expect(doc.paths['/api/v1/species/{key}']!['get']!.parameters).toEqual(
      expect.arrayContaining([expect.objectContaining({ name: 'key', in: 'path' })]),
    );
    // Routes that need a role say so; public ones do not ask for credentials.
    expect(doc.paths['/api/v1/proposals/{id}/decision']!['post']!.security).toBeDefined();
    expect(doc.paths['/api/v1/search']!['get']!.security).toBeUndefined();
  });

  const examples = Object.entries(ROUTE_DOCS).filter(([, d]) => d.example);
  it('has example requests for the public read and calculation routes', () => {
    expect(examples.length).toBeGreaterThanOrEqual(15);
  });

  it.each(examples)('example of %s succeeds and answers as documented', async (key, d) => {
    const [method, path] = key.split(' ') as [string, string];
    const url = path.replace(/:(\w+)/g, (_, name: string) => d.example!.path![name]!);
    let req = request(t.app)[method.toLowerCase() as 'get' | 'post'](url);
    if (d.example!.query) req = req.query(d.example!.query);
    const res =
      d.example!.body !== undefined ? await req.send(d.example!.body as object) : await req;
    expect({ key, status: res.status < 400 }).toEqual({ key, status: true });
    const schema = d.answers[res.status];
    expect(schema).toBeDefined();
    if (schema instanceof z.ZodType) schema.parse(res.body);
  });

  it('serves the reference page from this site only, under the app CSP', async () => {
    await request(t.app).get('/api/docs').expect(301).expect('location', '/api/docs/');
    const page = await request(t.app).get('/api/docs/').expect(200);
    const csp = page.headers['content-security-policy'] as string;
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    const scripts = [...page.text.matchAll(/<script([^>]*)>/g)].map((m) => m[1]!);
    expect(scripts.length).toBeGreaterThan(0);
    for (const attrs of scripts) expect(attrs).toMatch(/src=/); // no inline script
    const init = await request(t.app).get('/api/docs/swagger-ui-init.js').expect(200);
    expect(init.text).toContain('/api/v1/openapi.json');
    expect(init.text).toContain('"validatorUrl": null');
    await request(t.app).get('/api/docs/swagger-ui-bundle.js').expect(200);
  });
});
