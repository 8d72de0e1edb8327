import { randomBytes } from 'node:crypto';
import { availableParallelism } from 'node:os';
import path from 'node:path';
import { z } from 'zod';

/** Thrown when the environment cannot start the server; the message names every bad variable. */
export class ConfigError extends Error {
  constructor(readonly problems: string[]) {
    super(`Invalid environment:\n${problems.map((p) => `  ${p}`).join('\n')}`);
    this.name = 'ConfigError';
  }
}

/**
 * Local ports of ./tools/start. Only demo mode falls back to them, so a production deployment
 * that forgets a variable refuses to start instead of talking to the wrong service.
 */
const DEMO_DEFAULTS: Record<string, string> = {
  DB_PORT: '33061',
  DB_NAME: 'limbus',
  DB_USER: 'limbus',
  DB_PASSWORD: 'limbus',
  REDIS_URL: 'redis://127.0.0.1:63791',
  SMTP_URL: 'smtp://127.0.0.1:2525',
  MAIL_CATCHER_URL: 'http://127.0.0.1:2526',
  S3_ENDPOINT: 'http://127.0.0.1:4569',
  S3_ACCESS_KEY_ID: 'S3RVER',
  S3_SECRET_ACCESS_KEY: 'S3RVER',
  S3_FORCE_PATH_STYLE: '1',
};

const flag = z.enum(['0', '1', 'true', 'false']).transform((v) => v === '1' || v === 'true');
const port = z.coerce.number().int().min(1).max(65535);
const seconds = z.coerce.number().int().min(1);
const url = (protocols: string[]) =>
  z.url().refine((u) => protocols.includes(new URL(u).protocol), {
    message: `must be a ${protocols.join(' or ')} URL`,
  });

const envSchema = z.object({
  LIMBUS_DEMO: flag.default(false),
  LIMBUS_PORT: port.default(8080),
  // Loopback by default: the demo should not be reachable from the network unless asked.
  LIMBUS_HOST: z.string().min(1).default('127.0.0.1'),
  LIMBUS_PUBLIC_URL: url(['http:', 'https:']).optional(),
  // HTTP processes sharing the port (node:cluster); default one per core.
  LIMBUS_API_PROCESSES: z.coerce.number().int().min(1).max(64).optional(),
  WEB_DIST_DIR: z.string().min(1).optional(),
  // Express "trust proxy" value (e.g. "loopback" or a hop count) when a reverse proxy sets X-Forwarded-For;
  // unset, the socket address is the client address that sign-in limits count.
  LIMBUS_TRUST_PROXY: z.string().min(1).optional(),
  JWT_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  LIMBUS_ADMIN_EMAIL: z.email().optional(),
  LIMBUS_ADMIN_PASSWORD: z.string().min(10, 'must be at least 10 characters').optional(),
  ACCESS_TOKEN_TTL_SECONDS: seconds.default(15 * 60),
  REFRESH_TOKEN_TTL_SECONDS: seconds.default(30 * 24 * 3600),
  LOGIN_FAILURE_LIMIT: z.coerce.number().int().min(1).default(5),
  // Higher than the per-account limit: several people may share one address (an observatory's NAT).
  LOGIN_FAILURE_ADDRESS_LIMIT: z.coerce.number().int().min(1).default(50),
  LOGIN_FAILURE_WINDOW_SECONDS: seconds.default(15 * 60),
  DB_HOST: z.string().min(1).default('127.0.0.1'),
  DB_PORT: port,
  DB_NAME: z.string().min(1),
  DB_USER: z.string().min(1),
  DB_PASSWORD: z.string(),
  REDIS_URL: url(['redis:', 'rediss:']),
  SMTP_URL: url(['smtp:', 'smtps:']),
  MAIL_FROM: z.string().min(1).default('Limbus <no-reply@limbus.invalid>'),
  MAIL_CATCHER_URL: url(['http:', 'https:']).optional(),
  S3_ENDPOINT: url(['http:', 'https:']),
  S3_BUCKET: z.string().min(3).default('limbus'),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().min(1),
  S3_SECRET_ACCESS_KEY: z.string().min(1),
  S3_FORCE_PATH_STYLE: flag.default(true),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
});

/** Typed configuration; the one object every module reads instead of process.env. */
export class AppConfig {
  readonly demo!: boolean;
  readonly port!: number;
  readonly host!: string;
  /** Base of links in e-mails, without a trailing slash. */
  readonly publicUrl!: string;
  readonly webDistDir!: string;
  readonly apiProcesses!: number;
  readonly trustProxy!: string | number | null;
  readonly jwtSecret!: string;
  readonly initialAdmin!: { email: string; password: string } | null;
  readonly accessTokenTtlSeconds!: number;
  readonly refreshTokenTtlSeconds!: number;
  readonly loginFailureLimit!: number;
  readonly loginFailureAddressLimit!: number;
  readonly loginFailureWindowSeconds!: number;
  readonly db!: { host: string; port: number; name: string; user: string; password: string };
  readonly redisUrl!: string;
  readonly smtpUrl!: string;
  readonly mailFrom!: string;
  readonly mailCatcherUrl!: string | null;
  readonly s3!: {
    endpoint: string;
    bucket: string;
    region: string;
    accessKeyId: string;
    secretAccessKey: string;
    forcePathStyle: boolean;
  };
  readonly logLevel!: string;

  constructor(values: AppConfig) {
    Object.assign(this, values);
  }
}

const DEFAULT_WEB_DIST_DIR = path.resolve(__dirname, '../../../web/dist');

/**
 * Validates the environment once at start-up. Empty strings count as unset, because shell
 * scripts often export `VAR=` when they mean "not given".
 */
export function loadConfig(env: NodeJS.ProcessEnv): AppConfig {
  const given: Record<string, string> = {};
  for (const [key, value] of Object.entries(env)) {
    if (value !== undefined && value !== '') given[key] = value;
  }
  const demo = given.LIMBUS_DEMO === '1' || given.LIMBUS_DEMO === 'true';
  const input = demo ? { ...DEMO_DEFAULTS, ...given } : given;

  const parsed = envSchema.safeParse(input);
  const problems: string[] = [];
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const name = issue.path.join('.');
      problems.push(`${name}: ${input[name] === undefined ? 'is required' : issue.message}`);
    }
  }
  if (!demo) {
    for (const name of ['JWT_SECRET', 'LIMBUS_ADMIN_EMAIL', 'LIMBUS_ADMIN_PASSWORD']) {
      if (input[name] === undefined) problems.push(`${name}: is required outside demo mode (LIMBUS_DEMO=1)`);
    }
  }
  if (!parsed.success || problems.length > 0) throw new ConfigError(problems);

  const e = parsed.data;
  return new AppConfig({
    demo: e.LIMBUS_DEMO,
    port: e.LIMBUS_PORT,
    host: e.LIMBUS_HOST,
    publicUrl: (e.LIMBUS_PUBLIC_URL ?? `http://127.0.0.1:${e.LIMBUS_PORT}`).replace(/\/+$/, ''),
    webDistDir: e.WEB_DIST_DIR ? path.resolve(e.WEB_DIST_DIR) : DEFAULT_WEB_DIST_DIR,
    apiProcesses: e.LIMBUS_API_PROCESSES ?? availableParallelism(),
    trustProxy:
      e.LIMBUS_TRUST_PROXY === undefined
        ? null
        : /^\d+$/.test(e.LIMBUS_TRUST_PROXY)
          ? Number(e.LIMBUS_TRUST_PROXY)
          : e.LIMBUS_TRUST_PROXY,
    // A generated secret means every restart signs users out; acceptable only for the demo.
    jwtSecret: e.JWT_SECRET ?? randomBytes(48).toString('base64url'),
    initialAdmin:
      e.LIMBUS_ADMIN_EMAIL && e.LIMBUS_ADMIN_PASSWORD
        ? { email: e.LIMBUS_ADMIN_EMAIL.toLowerCase(), password: e.LIMBUS_ADMIN_PASSWORD }
        : null,
    accessTokenTtlSeconds: e.ACCESS_TOKEN_TTL_SECONDS,
    refreshTokenTtlSeconds: e.REFRESH_TOKEN_TTL_SECONDS,
    loginFailureLimit: e.LOGIN_FAILURE_LIMIT,
    loginFailureAddressLimit: e.LOGIN_FAILURE_ADDRESS_LIMIT,
    loginFailureWindowSeconds: e.LOGIN_FAILURE_WINDOW_SECONDS,
    db: { host: e.DB_HOST, port: e.DB_PORT, name: e.DB_NAME, user: e.DB_USER, password: e.DB_PASSWORD },
    redisUrl: e.REDIS_URL,
    smtpUrl: e.SMTP_URL,
    mailFrom: e.MAIL_FROM,
    mailCatcherUrl: e.MAIL_CATCHER_URL ?? null,
    s3: {
      endpoint: e.S3_ENDPOINT,
      bucket: e.S3_BUCKET,
      region: e.S3_REGION,
      accessKeyId: e.S3_ACCESS_KEY_ID,
      secretAccessKey: e.S3_SECRET_ACCESS_KEY,
      forcePathStyle: e.S3_FORCE_PATH_STYLE,
    },
    logLevel: e.LOG_LEVEL,
  });
}

/** For entry points: print the problems and exit instead of a stack trace. */
export function loadConfigOrExit(env: NodeJS.ProcessEnv): AppConfig {
  try {
    return loadConfig(env);
  } catch (error) {
    if (error instanceof ConfigError) {
      process.stderr.write(`${error.message}\n`);
      process.exit(2);
    }
    throw error;
  }
}
