import { z } from 'zod';
import { DEFAULT_CLIENT_DIST } from './paths';

const bool = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');

const EnvSchema = z
  .object({
    NODE_ENV: z.enum(['development', 'test', 'production']).default('development'),
    HOST: z.string().default('127.0.0.1'),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    /** The application's own role: only the rights it uses (see README, "Security"). */
    DATABASE_URL: z.string().url(),
    /** The schema owner's connection, for migrations at start-up; defaults to DATABASE_URL. */
    MIGRATION_DATABASE_URL: z.string().url().optional(),
    SESSION_SECRET: z.string().min(16).optional(),
    GITHUB_CLIENT_ID: z.string().min(1).optional(),
    GITHUB_CLIENT_SECRET: z.string().min(1).optional(),
    /** Base URL of an already running fake GitHub (tests start one of their own). */
    FAKE_GITHUB_URL: z.string().url().optional(),
    /** Port of the fake GitHub that the server starts in-process when no real one is configured. */
    FAKE_GITHUB_PORT: z.coerce.number().int().min(0).max(65535).default(3001),
    /** DOI metadata service (CSL-JSON by content negotiation); https://doi.org in production. */
    DOI_BASE_URL: z.string().url().optional(),
    /** Base URL of an already running fake DOI service (tests start one of their own). */
    FAKE_DOI_URL: z.string().url().optional(),
    /** Port of the fake DOI service that the server starts in-process when none is configured. */
    FAKE_DOI_PORT: z.coerce.number().int().min(0).max(65535).default(3004),
    /** S3 API endpoint for attached documents (path-style; any S3-compatible store). */
    S3_URL: z.string().url().optional(),
    /** Base URL of an already running local S3 stand-in (tests start one of their own). */
    FAKE_S3_URL: z.string().url().optional(),
    /** Port of the local S3 stand-in that the server starts in-process when none is configured. */
    FAKE_S3_PORT: z.coerce.number().int().min(0).max(65535).default(3005),
    S3_BUCKET: z.string().min(3).default('thalpos-documents'),
    S3_REGION: z.string().min(1).default('us-east-1'),
    S3_ACCESS_KEY_ID: z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
    /** GitHub logins that become admin at their first sign-in (bootstraps a real deployment). */
    ADMIN_LOGINS: z.string().default(''),
    /** The site's address as users reach it; links in e-mail point here. Default: HOST and PORT. */
    PUBLIC_URL: z.string().url().optional(),
    /** Outgoing mail relay, e.g. smtp://mail.example.org:587; unset outside production: a local fake. */
    SMTP_URL: z
      .string()
      .url()
      .refine((u) => !/^[a-z]+:\/\/([^@/]*@)?(0\.0\.0\.0|\[::\])(:|\/|$)/i.test(u), {
        message: 'must name a host, not 0.0.0.0',
      })
      .optional(),
    /** The From header of every message. */
    MAIL_FROM: z.string().min(3).default('Thalpos <no-reply@thalpos.invalid>'),
    /** An already running fake SMTP server (the test runner starts one of its own). */
    FAKE_SMTP_URL: z.string().url().optional(),
    /** Ports of the fake SMTP server and its message listing that `npm start` runs in-process. */
    FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
    FAKE_SMTP_API_PORT: z.coerce.number().int().min(0).max(65535).default(3002),
    CLIENT_DIST: z.string().default(DEFAULT_CLIENT_DIST),
    LOG_LEVEL: z
      .enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent'])
      .default('info'),
    TRUST_PROXY: bool.default(false),
    /** Defaults: on outside production, off in production. */
    DEMO_DATA: bool.optional(),
    /** The fake provider signs anyone in as a demo account: never on in production by default. */
    FAKE_SIGN_IN: bool.optional(),
    AUTH_RATE_LIMIT: z.coerce.number().int().positive().default(60),
    /** Requests per minute to /api/v1: per address when anonymous, per user when signed in. */
    API_RATE_LIMIT: z.coerce.number().int().positive().default(600),
    API_RATE_LIMIT_SIGNED_IN: z.coerce.number().int().positive().default(2400),
    /** Requests per minute per API token (never below the signed-in limit). */
    API_RATE_LIMIT_TOKEN: z.coerce.number().int().positive().default(6000),
    /** Key of the HMAC that API tokens are stored under; changing it invalidates every token. */
    TOKEN_HASH_KEY: z.string().min(32).optional(),
  })
  .superRefine((env, ctx) => {
    if (env.NODE_ENV === 'production' && !env.SESSION_SECRET) {
      ctx.addIssue({ code: 'custom', path: ['SESSION_SECRET'], message: 'required in production' });
    }
    if (env.NODE_ENV === 'production' && !env.TOKEN_HASH_KEY) {
      ctx.addIssue({ code: 'custom', path: ['TOKEN_HASH_KEY'], message: 'required in production' });
    }
    const fakeAllowed = env.FAKE_SIGN_IN ?? env.NODE_ENV !== 'production';
    if (!env.GITHUB_CLIENT_ID && !fakeAllowed) {
      ctx.addIssue({
        code: 'custom',
        path: ['GITHUB_CLIENT_ID'],
        message: 'required in production (or set FAKE_SIGN_IN=1 for a demo server)',
      });
    }
    if (env.S3_URL && !(env.S3_ACCESS_KEY_ID && env.S3_SECRET_ACCESS_KEY)) {
      ctx.addIssue({
        code: 'custom',
        path: ['S3_ACCESS_KEY_ID'],
        message: 'S3_URL needs S3_ACCESS_KEY_ID and S3_SECRET_ACCESS_KEY',
      });
    }
    if (Boolean(env.GITHUB_CLIENT_ID) !== Boolean(env.GITHUB_CLIENT_SECRET)) {
      ctx.addIssue({
        code: 'custom',
        path: ['GITHUB_CLIENT_SECRET'],
        message: 'GITHUB_CLIENT_ID and GITHUB_CLIENT_SECRET go together',
      });
    }
  });

export type Env = z.infer<typeof EnvSchema>;

export interface FileStoreConfig {
  endpoint: string;
  bucket: string;
  region: string;
  accessKeyId: string;
  secretAccessKey: string;
}

/** S3_URL, else the local stand-in (whose fixed credentials are its own, not secrets). */
function fileStoreConfig(e: Env): FileStoreConfig | null {
  const endpoint = e.S3_URL ?? e.FAKE_S3_URL;
  if (!endpoint) return null;
  const local = !e.S3_URL;
  return {
    endpoint,
    bucket: e.S3_BUCKET,
    region: e.S3_REGION,
    accessKeyId: e.S3_ACCESS_KEY_ID ?? (local ? LOCAL_S3_KEY : ''),
    secretAccessKey: e.S3_SECRET_ACCESS_KEY ?? (local ? LOCAL_S3_KEY : ''),
  };
}

/** The access key and secret the local S3 stand-in (s3rver) accepts. */
export const LOCAL_S3_KEY = 'S3RVER';

export interface AppConfig {
  env: Env['NODE_ENV'];
  host: string;
  port: number;
  databaseUrl: string;
  migrationDatabaseUrl: string;
  sessionSecret: string;
  /** Real GitHub credentials, or null when the fake provider stands in. */
  github: { clientId: string; clientSecret: string } | null;
  fakeGithubUrl: string | null;
  fakeGithubPort: number;
  publicUrl: string;
  mail: {
    /** The real relay, or null when a fake stands in (or, in production, mail waits in the outbox). */
    smtpUrl: string | null;
    fakeSmtpUrl: string | null;
    fakeSmtpPort: number;
    fakeSmtpApiPort: number;
    from: string;
  };
  adminLogins: string[];
  /** Where DOIs are resolved; null outside production until the local fake is started. */
  doiBaseUrl: string | null;
  fakeDoiPort: number;
  /** The S3 store for documents; null outside production until the local stand-in is started. */
  fileStore: FileStoreConfig | null;
  fakeS3Port: number;
  clientDist: string;
  logLevel: Env['LOG_LEVEL'];
  trustProxy: boolean;
  demoData: boolean;
  authRateLimit: number;
  apiRateLimit: number;
  apiRateLimitSignedIn: number;
  apiRateLimitToken: number;
  tokenHashKey: string;
}

/** Parses the environment once at start-up; a bad value stops the process with a clear message. */
export function loadConfig(source: NodeJS.ProcessEnv = process.env): AppConfig {
  const parsed = EnvSchema.safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid environment:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    env: e.NODE_ENV,
    host: e.HOST,
    port: e.PORT,
    databaseUrl: e.DATABASE_URL,
    migrationDatabaseUrl: e.MIGRATION_DATABASE_URL ?? e.DATABASE_URL,
    sessionSecret: e.SESSION_SECRET ?? 'thalpos-development-secret-not-for-production',
    github:
      e.GITHUB_CLIENT_ID && e.GITHUB_CLIENT_SECRET
        ? { clientId: e.GITHUB_CLIENT_ID, clientSecret: e.GITHUB_CLIENT_SECRET }
        : null,
    fakeGithubUrl: e.FAKE_GITHUB_URL ?? null,
    fakeGithubPort: e.FAKE_GITHUB_PORT,
    publicUrl: (e.PUBLIC_URL ?? `http://${e.HOST}:${e.PORT}`).replace(/\/+$/, ''),
    mail: {
      smtpUrl: e.SMTP_URL ?? null,
      fakeSmtpUrl: e.FAKE_SMTP_URL ?? null,
      fakeSmtpPort: e.FAKE_SMTP_PORT,
      fakeSmtpApiPort: e.FAKE_SMTP_API_PORT,
      from: e.MAIL_FROM,
    },
    doiBaseUrl:
      e.DOI_BASE_URL ?? e.FAKE_DOI_URL ?? (e.NODE_ENV === 'production' ? 'https://doi.org' : null),
    fakeDoiPort: e.FAKE_DOI_PORT,
    fileStore: fileStoreConfig(e),
    fakeS3Port: e.FAKE_S3_PORT,
    adminLogins: e.ADMIN_LOGINS.split(',')
      .map((s) => s.trim())
      .filter(Boolean),
    clientDist: e.CLIENT_DIST,
    logLevel: e.LOG_LEVEL,
    trustProxy: e.TRUST_PROXY,
    demoData: e.DEMO_DATA ?? e.NODE_ENV !== 'production',
    authRateLimit: e.AUTH_RATE_LIMIT,
    apiRateLimit: e.API_RATE_LIMIT,
    apiRateLimitSignedIn: Math.max(e.API_RATE_LIMIT_SIGNED_IN, e.API_RATE_LIMIT),
    apiRateLimitToken: Math.max(
      e.API_RATE_LIMIT_TOKEN,
      e.API_RATE_LIMIT_SIGNED_IN,
      e.API_RATE_LIMIT,
    ),
    tokenHashKey: e.TOKEN_HASH_KEY ?? 'thalpos-development-token-key-not-for-production',
  };
}
