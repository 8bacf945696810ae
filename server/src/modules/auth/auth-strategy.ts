import passportModule from 'passport';
import { Strategy as GitHubStrategy, type Profile, type StrategyOptions } from 'passport-github2';
import type { UserRow } from '../../../../schema';
import type { UsersService } from '../users/users-service';

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // The session user is the database row, re-read on every request so role changes apply at once.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserRow {}
  }
}

export type PassportInstance = passportModule.Authenticator;

export interface GithubEndpoints {
  clientId: string;
  clientSecret: string;
  /** Base URL of the web flow (github.com or the fake) and of the API (api.github.com or the fake). */
  webBase: string;
  apiBase: string;
}

export const REAL_GITHUB = { webBase: 'https://github.com', apiBase: 'https://api.github.com' };

/** A passport instance of our own (not the global singleton), so several apps can run in one process. */
export function createPassport(users: UsersService, github: GithubEndpoints): PassportInstance {
  const passport = new passportModule.Passport();
  const options = {
    clientID: github.clientId,
    clientSecret: github.clientSecret,
    // Relative: passport resolves it against the request's host, so any port works.
    callbackURL: '/auth/github/callback',
    authorizationURL: `${github.webBase}/login/oauth/authorize`,
    tokenURL: `${github.webBase}/login/oauth/access_token`,
    userProfileURL: `${github.apiBase}/user`,
    scope: [],
    // Binds the authorize round trip to this browser's session (OAuth `state`), and the code
    // to this client with PKCE (S256): an intercepted code cannot be redeemed elsewhere.
    state: true,
    pkce: true,
  };
  const strategy = new GitHubStrategy(
    // passport-oauth2 takes `state: true`; the passport-github2 typings only know a string.
    options as unknown as StrategyOptions,
    (
      _access: string,
      _refresh: string,
      profile: Profile,
      done: (e: unknown, u?: UserRow) => void,
    ) => {
      const json = (profile as Profile & { _json: unknown })._json as {
        id: number;
        login: string;
        name?: string | null;
        email?: string | null;
        avatar_url?: string | null;
      };
      users
        .signIn({
          githubId: Number(json.id),
          login: json.login,
          name: json.name || json.login,
          email: json.email ?? null,
          avatarUrl: json.avatar_url ?? null,
        })
        .then((u) => done(null, u), done);
    },
  );
  // Forwards GitHub's `login` authorize parameter, which passport-oauth2 drops by default.
  strategy.authorizationParams = (options: { login?: string }) =>
    options.login ? { login: options.login } : {};
  passport.use(strategy);
  passport.serializeUser<number>((user, done) => done(null, user.id));
  passport.deserializeUser<number>((id, done) => {
    users.findById(id).then((u) => done(null, u ?? false), done);
  });
  return passport;
}
