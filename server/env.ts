import os from 'node:os';
import path from 'node:path';

/** The one place that reads process.env. Everything else imports `env` or calls `loadEnv()`. */
export interface Env {
  port: number;
  dataDir: string;
  nodeEnv: 'production' | 'development' | 'test';
  /** demo mode: fake SMTP, outbox page, demo production seeded on first run */
  demo: boolean;
  sessionSecret: string;
  publicUrl: string;
  smtp: { host: string; port: number; user?: string; pass?: string; secure: boolean } | null;
  mailFrom: string;
  /** limits on the auth routes (requests per window); tests lift them */
  authRateLimit: number;
  /** limit on state-changing API requests (POST/PUT/PATCH/DELETE) per minute per address */
  writeRateLimit: number;
  /**
   * Express's `trust proxy` (TRUST_PROXY): false by default, so a client cannot choose its address with
   * X-Forwarded-For; behind a proxy give its hop count (1), address or subnet, or 'loopback'.
   */
  trustProxy: boolean | number | string;
  /** a request body that sends nothing for this long is answered 408 (BODY_IDLE_TIMEOUT_MS, default 30 s) */
  bodyIdleTimeoutMs: number;
  /** demo mode was asked for explicitly (GRISAILLE_DEMO=true) on a public address: warn loudly, show a banner */
  demoOnPublicHost: boolean;
  /** a session ends this many days after sign-in whatever its activity (SESSION_MAX_AGE_DAYS, default 30) */
  sessionMaxAgeDays: number;
  /** the most a production's photos may take on disk, originals, previews and thumbnails (PRODUCTION_QUOTA_MB, default 2048) */
  productionQuotaBytes: number;
  /** threads of the compute pool (COMPUTE_WORKERS; default min(2, cores); 0 computes on the main thread) */
  computeWorkers: number;
  /** computations that may wait for a thread; one more answers 503 (COMPUTE_QUEUE_LIMIT, default 32) */
  computeQueueLimit: number;
  /** heavy computations one user may have running at once; one more answers 429 (FAIR_USE_CONCURRENCY, default 2) */
  fairUseConcurrency: number;
  /** work (swatches simulated; a shade counts 50) one user may ask for per minute; 0 = no budget (FAIR_USE_WORK_PER_MINUTE, default 60,000) */
  fairUseWorkPerMinute: number;
}

/** A whole number ≥ `min` from the environment, else `fallback`. */
function wholeNumber(v: string | undefined, fallback: number, min = 0): number {
  const n = Number(v);
  return v !== undefined && v !== '' && Number.isFinite(n) ? Math.max(min, Math.floor(n)) : fallback;
}

/** PRODUCTION_QUOTA_MB in bytes: a positive number of megabytes (MiB), 2048 when unset. */
function quotaBytes(v: string | undefined): number {
  const mb = Number(v ?? 2048);
  if (!Number.isFinite(mb) || mb <= 0) throw new ConfigError(`PRODUCTION_QUOTA_MB is "${v}"; give a positive number of megabytes, e.g. 2048.`);
  return Math.round(mb * 1024 * 1024);
}

/** The secret of a local demo start when SESSION_SECRET is not set (public: never valid outside demo mode). */
const DEMO_SESSION_SECRET = 'grisaille-local-secret-change-me';

/** Minimum length of SESSION_SECRET outside demo mode (32 characters: 192 bits or more of a random string). */
export const MIN_SESSION_SECRET = 32;

/** True when a public URL names this machine (localhost, a loopback address) rather than a real host. */
export function isLocalUrl(url: string): boolean {
  let host: string;
  try {
    host = new URL(url).hostname.toLowerCase();
  } catch {
    return false;
  }
  host = host.replace(/^\[|\]$/g, '');
  return host === 'localhost' || host.endsWith('.localhost') || /^127(\.\d{1,3}){3}$/.test(host) || host === '::1' || host === '0:0:0:0:0:0:0:1';
}

/** TRUST_PROXY as Express takes it: 'true'/'false', a hop count, or addresses/subnets/names as given. */
function parseTrustProxy(v: string | undefined): boolean | number | string {
  if (v === undefined || v === '' || v === 'false') return false;
  if (v === 'true') return true;
  if (/^\d+$/.test(v)) return Number(v);
  return v;
}

/** Thrown by loadEnv for a configuration the server must not start with. */
export class ConfigError extends Error {}

export function loadEnv(overrides: Partial<Env> = {}): Env {
  const e = process.env;
  const nodeEnv = (e.NODE_ENV === 'production' || e.NODE_ENV === 'test' ? e.NODE_ENV : 'development') as Env['nodeEnv'];
  const port = Number(e.PORT ?? 5178);
  const publicUrl = e.PUBLIC_URL ?? `http://localhost:${port}`;
  const local = isLocalUrl(publicUrl);
  // demo mode (published demo passwords, the outbox page) only on a local start, unless asked for explicitly
  const demo = e.GRISAILLE_DEMO === 'true' || (e.GRISAILLE_DEMO !== 'false' && local);
  const smtp = e.SMTP_HOST
    ? { host: e.SMTP_HOST, port: Number(e.SMTP_PORT ?? 587), user: e.SMTP_USER, pass: e.SMTP_PASS, secure: e.SMTP_SECURE === 'true' }
    : null;
  const merged: Env = {
    port,
    dataDir: path.resolve(e.DATA_DIR ?? 'data'),
    nodeEnv,
    demo,
    demoOnPublicHost: false,
    sessionSecret: e.SESSION_SECRET ?? (demo ? DEMO_SESSION_SECRET : ''),
    publicUrl,
    smtp,
    mailFrom: e.MAIL_FROM ?? 'Grisaille <no-reply@grisaille.test>',
    authRateLimit: Number(e.AUTH_RATE_LIMIT ?? 30),
    writeRateLimit: Number(e.WRITE_RATE_LIMIT ?? 600),
    trustProxy: parseTrustProxy(e.TRUST_PROXY),
    bodyIdleTimeoutMs: Number(e.BODY_IDLE_TIMEOUT_MS ?? 30_000),
    sessionMaxAgeDays: Number(e.SESSION_MAX_AGE_DAYS ?? 30),
    // two threads leave the main thread a core on a small host; one on a single-core host
    computeWorkers: wholeNumber(e.COMPUTE_WORKERS, Math.max(1, Math.min(2, os.availableParallelism()))),
    computeQueueLimit: wholeNumber(e.COMPUTE_QUEUE_LIMIT, 32),
    fairUseConcurrency: wholeNumber(e.FAIR_USE_CONCURRENCY, 2, 1),
    fairUseWorkPerMinute: wholeNumber(e.FAIR_USE_WORK_PER_MINUTE, 60_000),
    productionQuotaBytes: quotaBytes(e.PRODUCTION_QUOTA_MB),
    ...overrides,
  };
  merged.demoOnPublicHost = overrides.demoOnPublicHost ?? (merged.demo && !isLocalUrl(merged.publicUrl));
  return merged;
}

/**
 * Refuses a configuration that is unsafe to serve: outside demo mode the session secret must be set and
 * long (OWASP ASVS 4.0.3 §3.5 / §6.4: keys from configuration, not code). Messages say what to set.
 */
export function checkEnv(env: Env): void {
  if (!env.demo && env.sessionSecret === DEMO_SESSION_SECRET) {
    throw new ConfigError('SESSION_SECRET is the published local default; outside demo mode set a random one. Generate one with: openssl rand -base64 48');
  }
  if (!env.demo && env.sessionSecret.length < MIN_SESSION_SECRET) {
    throw new ConfigError(
      env.sessionSecret
        ? `SESSION_SECRET is ${env.sessionSecret.length} characters long; it must be at least ${MIN_SESSION_SECRET}. Generate one with: openssl rand -base64 48`
        : `SESSION_SECRET is not set. Outside demo mode (PUBLIC_URL names ${safeHost(env.publicUrl)}) Grisaille needs a random secret of at least ${MIN_SESSION_SECRET} characters to sign sessions. Generate one with: openssl rand -base64 48`,
    );
  }
}

function safeHost(url: string): string {
  try {
    return new URL(url).host;
  } catch {
    return 'a public host';
  }
}
