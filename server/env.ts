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
}

export function loadEnv(overrides: Partial<Env> = {}): Env {
  const e = process.env;
  const nodeEnv = (e.NODE_ENV === 'production' || e.NODE_ENV === 'test' ? e.NODE_ENV : 'development') as Env['nodeEnv'];
  const port = Number(e.PORT ?? 5178);
  const smtp = e.SMTP_HOST
    ? { host: e.SMTP_HOST, port: Number(e.SMTP_PORT ?? 587), user: e.SMTP_USER, pass: e.SMTP_PASS, secure: e.SMTP_SECURE === 'true' }
    : null;
  return {
    port,
    dataDir: path.resolve(e.DATA_DIR ?? 'data'),
    nodeEnv,
    demo: e.GRISAILLE_DEMO !== 'false',
    sessionSecret: e.SESSION_SECRET ?? 'grisaille-local-secret-change-me',
    publicUrl: e.PUBLIC_URL ?? `http://localhost:${port}`,
    smtp,
    mailFrom: e.MAIL_FROM ?? 'Grisaille <no-reply@grisaille.test>',
    authRateLimit: Number(e.AUTH_RATE_LIMIT ?? 30),
    writeRateLimit: Number(e.WRITE_RATE_LIMIT ?? 600),
    ...overrides,
  };
}
