import request from 'supertest';
import { THERMO_ERROR_STATUS } from '../../server/src/middleware/error-handler';
import { THERMO_ERROR_CODES } from '../../server/src/thermo';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

describe('error responses', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  const expectErrorShape = (body: unknown, code: string) => {
    expect(body).toMatchObject({ error: { code, message: expect.any(String) } });
    expect(JSON.stringify(body)).not.toMatch(/at .*\.(ts|js):\d+/);
  };

  it('answers an unknown /api route with a JSON 404', async () => {
    const res = await request(t.app).get('/api/v1/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/json/);
    expectErrorShape(res.body, 'not_found');
    expect(res.body.error.message).toContain('/api/v1/no-such-thing');
  });

  it('answers an unknown method on a known path with a JSON 404', async () => {
    const res = await request(t.app).delete('/api/health').expect(404);
    expectErrorShape(res.body, 'not_found');
  });

  it('rejects malformed JSON with 400 invalid_json', async () => {
    const res = await request(t.app)
      .post('/api/v1/users')
      .set('Content-Type', 'application/json')
      .send('{"role": "admin",')
      .expect(400);
    expectErrorShape(res.body, 'invalid_json');
  });

  it('rejects a body over the limit with 413', async () => {
    const res = await request(t.app)
      .post('/api/v1/users')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ pad: 'x'.repeat(200_000) }))
      .expect(413);
    expectErrorShape(res.body, 'payload_too_large');
  });

  it('answers a validation failure with 400 and the offending field', async () => {
    const agent = request.agent(t.app);
    const xsrf = await signIn(agent, 'demo-admin');
    const res = await agent
      .patch('/api/v1/users/1')
      .set('X-XSRF-TOKEN', xsrf)
      .send({ role: 'overlord' })
      .expect(400);
    expectErrorShape(res.body, 'validation_error');
    expect(res.body.error.message).toContain('role');
  });

  it('maps every engine error code to a client-error status', () => {
    for (const code of THERMO_ERROR_CODES) {
      expect(THERMO_ERROR_STATUS[code]).toBeGreaterThanOrEqual(400);
      expect(THERMO_ERROR_STATUS[code]).toBeLessThan(500);
    }
    expect(Object.keys(THERMO_ERROR_STATUS).sort()).toEqual([...THERMO_ERROR_CODES].sort());
  });

  it('sets security headers, including a Content-Security-Policy', async () => {
    const res = await request(t.app).get('/api/health');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("default-src 'self'");
    expect(csp).not.toMatch(/https:/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-request-id']).toBeTruthy();
  });

  it('serves the client for any other path (SPA fallback)', async () => {
    const res = await request(t.app).get('/admin/users').expect(200);
    expect(res.headers['content-type']).toMatch(/html/);
    expect(res.text).toContain('<thalpos-root');
  });
});
