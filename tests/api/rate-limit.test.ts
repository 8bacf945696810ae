import request from 'supertest';
import { createTestApp, signIn, type TestApp } from '../support/test-app';

describe('API rate limits', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ API_RATE_LIMIT: '3', API_RATE_LIMIT_SIGNED_IN: '6' });
  });
  afterAll(() => t.close());

  const parse = () => ({ equation: 'H2(g) + Cl2(g) -> 2 HCl(g)' });

  it('limits anonymous callers per address, with Retry-After and RateLimit headers', async () => {
    for (let i = 0; i < 3; i++) {
      const ok = await request(t.app).post('/api/v1/equations/parse').send(parse()).expect(200);
      expect(ok.headers['ratelimit-policy']).toMatch(/q=3; w=60/);
    }
    const res = await request(t.app).post('/api/v1/equations/parse').send(parse()).expect(429);
    expect(res.body.error.code).toBe('rate_limited');
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
    expect(res.headers['ratelimit']).toMatch(/r=0; t=\d+/);
  });

  it('gives each signed-in user a bucket of their own, with the higher limit', async () => {
    // Signed-in requests from the same address as the exhausted anonymous bucket still pass.
    const reader = request.agent(t.app);
    const curator = request.agent(t.app);
    await signIn(reader, 'demo-reader');
    await signIn(curator, 'demo-curator');
    for (let i = 0; i < 6; i++) await reader.get('/api/v1/me').expect(200);
    const limited = await reader.get('/api/v1/me').expect(429);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);
    expect(limited.headers['ratelimit-policy']).toMatch(/q=6; w=60/);
    await curator.get('/api/v1/me').expect(200);
  });
});
