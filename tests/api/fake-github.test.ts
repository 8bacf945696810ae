import { spawn } from 'node:child_process';
import path from 'node:path';
import { PROJECT_ROOT } from '../../server/src/config/paths';

interface FakeProcess {
  url: string;
  stop(): Promise<void>;
}

/** The stand-in runs as its own process: it is an ES module, which CommonJS Jest cannot load. */
async function startFakeGithub(callbackUrls?: string[]): Promise<FakeProcess> {
  const child = spawn(
    path.join(PROJECT_ROOT, 'node_modules/.bin/tsx'),
    ['server/src/fakes/main.ts'],
    {
      cwd: PROJECT_ROOT,
      env: {
        ...process.env,
        FAKE_GITHUB_PORT: '0',
        FAKE_GITHUB_CALLBACK_URLS: callbackUrls?.join(',') ?? '',
      },
      stdio: ['ignore', 'pipe', 'pipe'],
    },
  );
  const exited = new Promise<void>((resolve) => child.on('exit', () => resolve()));
  let output = '';
  const url = await new Promise<string>((resolve, reject) => {
    child.stdout.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      const m = /^FAKE_GITHUB_URL=(http\S+)$/m.exec(output);
      if (m) resolve(m[1]);
    });
    child.on('exit', () => reject(new Error(`fake exited: ${output}`)));
  });
  return {
    url,
    stop: async () => {
      child.kill('SIGTERM');
      await exited;
    },
  };
}

// The local sign-in stand-in: loopback only, no CORS, codes only to the app's own callback.
describe('local sign-in stand-in', () => {
  let fake: FakeProcess;
  const callback = 'http://127.0.0.1:3999/auth/github/callback';
  beforeAll(async () => {
    fake = await startFakeGithub([callback]);
  }, 30_000);
  afterAll(() => fake.stop());

  const authorize = (redirectUri: string, headers: Record<string, string> = {}) => {
    const url = new URL('/login/oauth/authorize', fake.url);
    url.search = new URLSearchParams({
      client_id: 'thalpos-local',
      response_type: 'code',
      redirect_uri: redirectUri,
      state: 's1',
      login: 'demo-reader',
    }).toString();
    return fetch(url, { redirect: 'manual', headers });
  };

  it('listens on loopback only', () => {
    expect(new URL(fake.url).hostname).toBe('127.0.0.1');
  });

  it("sends the code to the app's own callback", async () => {
    const res = await authorize(callback);
    expect(res.status).toBe(302);
    const to = new URL(res.headers.get('location')!);
    expect(to.origin + to.pathname).toBe(callback);
    expect(to.searchParams.get('code')).toBeTruthy();
  });

  it.each([
    'https://evil.example/auth/github/callback',
    'http://127.0.0.1:3999/elsewhere',
    'http://127.0.0.1:4000/auth/github/callback',
  ])('refuses to send a code to %s', async (uri) => {
    const res = await authorize(uri);
    expect(res.status).toBe(400);
    expect(res.headers.get('location')).toBeNull();
  });

  it('answers no cross-origin request', async () => {
    const res = await authorize(callback, { Origin: 'https://evil.example' });
    expect(res.headers.get('access-control-allow-origin')).toBeNull();
    const token = await fetch(new URL('/login/oauth/access_token', fake.url), {
      method: 'POST',
      headers: { Origin: 'https://evil.example' },
    });
    expect(token.headers.get('access-control-allow-origin')).toBeNull();
    const preflight = await fetch(new URL('/user', fake.url), {
      method: 'OPTIONS',
      headers: { Origin: 'https://evil.example', 'Access-Control-Request-Method': 'GET' },
    });
    expect(preflight.headers.get('access-control-allow-origin')).toBeNull();
  });

  it('accepts any loopback callback on the callback path when no exact URL is given', async () => {
    const shared = await startFakeGithub();
    try {
      const url = new URL('/login/oauth/authorize', shared.url);
      const go = (uri: string) => {
        url.search = new URLSearchParams({
          client_id: 'x',
          response_type: 'code',
          redirect_uri: uri,
          state: 's',
          login: 'demo-reader',
        }).toString();
        return fetch(url, { redirect: 'manual' });
      };
      expect((await go('http://127.0.0.1:41234/auth/github/callback')).status).toBe(302);
      expect((await go('http://evil.example/auth/github/callback')).status).toBe(400);
    } finally {
      await shared.stop();
    }
  }, 30_000);
});
