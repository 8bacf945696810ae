import { loadConfig } from './env';

const base = { DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/thalpos' };

describe('loadConfig', () => {
  it('applies development defaults', () => {
    const c = loadConfig(base);
    expect(c).toMatchObject({
      env: 'development',
      host: '127.0.0.1',
      port: 3000,
      github: null,
      demoData: true,
    });
  });

  it('names every invalid variable', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(
      /DATABASE_URL[\s\S]*PORT|PORT[\s\S]*DATABASE_URL/,
    );
  });

  it('requires a session secret and real GitHub credentials in production', () => {
    expect(() => loadConfig({ ...base, NODE_ENV: 'production' })).toThrow(
      /SESSION_SECRET[\s\S]*TOKEN_HASH_KEY[\s\S]*GITHUB_CLIENT_ID/,
    );
    const c = loadConfig({
      ...base,
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-long-enough-secret-value',
      TOKEN_HASH_KEY: 'a-token-hash-key-of-32-characters-or-more',
      GITHUB_CLIENT_ID: 'id',
      GITHUB_CLIENT_SECRET: 'secret',
    });
    expect(c.github).toEqual({ clientId: 'id', clientSecret: 'secret' });
    expect(c.demoData).toBe(false);
  });

  it('allows the fake provider in production only when asked for', () => {
    const c = loadConfig({
      ...base,
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-long-enough-secret-value',
      TOKEN_HASH_KEY: 'a-token-hash-key-of-32-characters-or-more',
      FAKE_SIGN_IN: '1',
    });
    expect(c.github).toBeNull();
  });

  it('keeps the token limit at or above the signed-in limit', () => {
    const c = loadConfig({ ...base, API_RATE_LIMIT_SIGNED_IN: '9000', API_RATE_LIMIT_TOKEN: '10' });
    expect(c.apiRateLimitToken).toBe(9000);
    expect(loadConfig(base).apiRateLimitToken).toBe(6000);
  });

  it('refuses half a set of GitHub credentials', () => {
    expect(() => loadConfig({ ...base, GITHUB_CLIENT_ID: 'id' })).toThrow(/GITHUB_CLIENT_SECRET/);
  });

  it('splits the admin bootstrap list', () => {
    expect(loadConfig({ ...base, ADMIN_LOGINS: ' alice, bob ,,' }).adminLogins).toEqual([
      'alice',
      'bob',
    ]);
  });
});
