import path from 'node:path';
import { z } from 'zod';

/**
 * The only reader of process.env. Every key has a default so the server runs with nothing set;
 * a bad value stops start-up with one message naming each broken key.
 */

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(4300),
  HOST: z.string().min(1).default('127.0.0.1'),
  DATA_DIR: z.string().min(1).default('./data'),
  DATABASE_PATH: z.string().min(1).optional(),
  SESSION_SECRET: z.string().min(32, 'must be at least 32 characters').optional(),
  PUBLIC_URL: z.url({ protocol: /^https?$/, error: 'must be an http(s) URL' }).optional(),
  SMTP_HOST: z.string().min(1).default('localhost'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(587),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASS: z.string().min(1).optional(),
  SMTP_FROM: z.string().min(3).default('Taulens <no-reply@taulens.local>'),
  FAKE_SMTP: z.stringbool().optional(),
  FAKE_SMTP_PORT: z.coerce.number().int().min(0).max(65535).default(0),
  UPLOAD_LIMIT_MB: z.coerce.number().int().min(1).max(10240).default(1024),
  RESULTS_UPLOAD_KEEP_HOURS: z.coerce.number().int().min(1).max(24 * 365).default(72),
  TRUST_PROXY: z.string().min(1).default('false'),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  SEED_DEMO: z.stringbool().optional(),
  WEB_ROOT: z.string().min(1).default('dist/web/browser'),
});

type EnvKey = keyof z.input<typeof envSchema>;

/** Default (as written in the docs) and one-line description of every key; the type keeps it complete. */
export const configDocs: Record<EnvKey, { default: string; description: string }> = {
  NODE_ENV: { default: 'development', description: 'development, production or test; sets the FAKE_SMTP and SEED_DEMO defaults' },
  PORT: { default: '4300', description: 'TCP port the HTTP server listens on (0 picks a free port)' },
  HOST: { default: '127.0.0.1', description: 'interface the HTTP server binds to (0.0.0.0 for all)' },
  DATA_DIR: { default: './data', description: 'folder for the database, sessions, uploaded files and the generated session secret' },
  DATABASE_PATH: { default: 'DATA_DIR/taulens.sqlite', description: 'SQLite database file' },
  SESSION_SECRET: { default: 'generated once, kept in DATA_DIR/session-secret', description: 'secret signing session cookies and CSRF tokens (32+ characters)' },
  PUBLIC_URL: { default: 'http://localhost:PORT', description: 'address users open; used in e-mail links; https here turns on secure cookies and HSTS' },
  SMTP_HOST: { default: 'localhost', description: 'SMTP server for outgoing e-mail (ignored when FAKE_SMTP is on)' },
  SMTP_PORT: { default: '587', description: 'SMTP port (465 means TLS from the start, others use STARTTLS when offered)' },
  SMTP_USER: { default: '(none)', description: 'SMTP user name, if the server requires sign-in' },
  SMTP_PASS: { default: '(none)', description: 'SMTP password' },
  SMTP_FROM: { default: 'Taulens <no-reply@taulens.local>', description: 'sender of invitation and password-reset e-mails' },
  FAKE_SMTP: { default: 'true unless NODE_ENV=production', description: 'run the built-in loopback SMTP server that keeps every message in the dev outbox' },
  FAKE_SMTP_PORT: { default: '0', description: 'loopback port of the built-in SMTP server (0 picks a free port)' },
  UPLOAD_LIMIT_MB: { default: '1024', description: 'largest accepted upload (IFC models, result files) in MB' },
  RESULTS_UPLOAD_KEEP_HOURS: { default: '72', description: 'a shear-results upload not imported by then is removed (its file too, unless a result set uses it)' },
  TRUST_PROXY: { default: 'false', description: 'Express trust proxy: true, false, a hop count or a list of addresses; set it behind a TLS proxy' },
  LOG_LEVEL: { default: 'info', description: 'fatal, error, warn, info, debug, trace or silent' },
  SEED_DEMO: { default: 'true when NODE_ENV=development', description: 'create the demo users and projects at start (skipped when they exist)' },
  WEB_ROOT: { default: 'dist/web/browser', description: 'folder of the built Angular client' },
};

export type NodeEnv = z.output<typeof envSchema>['NODE_ENV'];
export type LogLevel = z.output<typeof envSchema>['LOG_LEVEL'];

export interface SmtpConfig {
  host: string;
  port: number;
  user?: string;
  pass?: string;
  from: string;
}

export interface Config {
  nodeEnv: NodeEnv;
  port: number;
  host: string;
  /** Absolute. */
  dataDir: string;
  /** Absolute. */
  databasePath: string;
  /** Undefined until start-up reads or creates the stored one. */
  sessionSecret?: string;
  /** Without a trailing slash. */
  publicUrl: string;
  smtp: SmtpConfig;
  fakeSmtp: boolean;
  fakeSmtpPort: number;
  uploadLimitMb: number;
  /** How long a results upload waits to be imported (or imported again) before it is removed. */
  resultsUploadKeepHours: number;
  trustProxy: boolean | number | string;
  logLevel: LogLevel;
  seedDemo: boolean;
  /** Absolute. */
  webRoot: string;
}

export class ConfigError extends Error {
  override name = 'ConfigError';
}

/**
 * Reads the configuration from `env`; `overrides` win over the environment and feed the derived
 * defaults (an overridden dataDir moves the default database path with it).
 */
export function loadConfig(env: NodeJS.ProcessEnv = process.env, overrides: Partial<Config> = {}): Config {
  const parsed = envSchema.safeParse(withoutEmptyValues(env));
  if (!parsed.success) throw new ConfigError(describeIssues(parsed.error));
  const e = parsed.data;

  const nodeEnv = overrides.nodeEnv ?? e.NODE_ENV;
  const port = overrides.port ?? e.PORT;
  const dataDir = path.resolve(overrides.dataDir ?? e.DATA_DIR);
  return {
    nodeEnv,
    port,
    host: e.HOST,
    sessionSecret: e.SESSION_SECRET,
    smtp: { host: e.SMTP_HOST, port: e.SMTP_PORT, user: e.SMTP_USER, pass: e.SMTP_PASS, from: e.SMTP_FROM },
    fakeSmtp: e.FAKE_SMTP ?? nodeEnv !== 'production',
    fakeSmtpPort: e.FAKE_SMTP_PORT,
    uploadLimitMb: e.UPLOAD_LIMIT_MB,
    resultsUploadKeepHours: e.RESULTS_UPLOAD_KEEP_HOURS,
    trustProxy: parseTrustProxy(e.TRUST_PROXY),
    logLevel: e.LOG_LEVEL,
    seedDemo: e.SEED_DEMO ?? nodeEnv === 'development',
    webRoot: path.resolve(e.WEB_ROOT),
    ...overrides,
    dataDir,
    databasePath: path.resolve(overrides.databasePath ?? e.DATABASE_PATH ?? path.join(dataDir, 'taulens.sqlite')),
    publicUrl: (overrides.publicUrl ?? e.PUBLIC_URL ?? `http://localhost:${port}`).replace(/\/+$/, ''),
  };
}

/**
 * The dev outbox (GET /api/dev/outbox) holds every caught e-mail, reset and invitation links included: it exists only
 * outside production, with the built-in SMTP server on, and only site admins may read it.
 */
export function servesDevOutbox(config: Pick<Config, 'fakeSmtp' | 'nodeEnv'>): boolean {
  return config.fakeSmtp && config.nodeEnv !== 'production';
}

/** Secure cookies and HSTS follow the address users open, not the socket (a TLS proxy may sit in front). */
export function usesTls(config: Pick<Config, 'publicUrl'>): boolean {
  return new URL(config.publicUrl).protocol === 'https:';
}

// `PORT=` in a shell or .env file means "not set", not "set to nothing".
function withoutEmptyValues(env: NodeJS.ProcessEnv): Record<string, string> {
  return Object.fromEntries(Object.entries(env).filter((entry): entry is [string, string] => entry[1] !== undefined && entry[1] !== ''));
}

function describeIssues(error: z.ZodError): string {
  const lines = error.issues.map((issue) => {
    const key = String(issue.path[0]) as EnvKey;
    return `  ${key}: ${issue.message} (${configDocs[key]?.description ?? 'unknown key'})`;
  });
  return `Invalid configuration:\n${lines.join('\n')}`;
}

function parseTrustProxy(value: string): boolean | number | string {
  if (value === 'true') return true;
  if (value === 'false') return false;
  if (/^\d+$/.test(value)) return Number(value);
  return value;
}
