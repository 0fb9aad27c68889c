import { createApp } from './app';
import { ConfigError } from './env';
import { applyServerTimeouts } from './http-server';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './db/seed';
import { getUpsampleTable } from './services/upsample-table';
import { markServerRunning } from './services/backup';

const started = Date.now();
// files the server writes (database, uploads, renders, logs of its own) are its user's only
process.umask(0o077);
const created = await createApp().catch((e: unknown) => {
  if (e instanceof ConfigError) {
    console.error(`Grisaille cannot start: ${e.message}`);
    process.exit(1);
  }
  throw e;
});
const { app, ctx, seeded } = created;
// DATA_DIR/server.pid tells `npm run restore` that a server uses this data; removed when the process exits
process.on('exit', markServerRunning(ctx.env.dataDir));
const server = app.listen(ctx.env.port, (err?: Error) => {
  if (err) throw err;
  if (ctx.env.demoOnPublicHost) {
    const bar = '!'.repeat(78);
    console.warn(`${bar}\n! DEMO MODE ON A PUBLIC ADDRESS (${ctx.env.publicUrl}): GRISAILLE_DEMO=true.\n! The demo accounts' password is published and the outbox shows every mail, reset links included.\n! Anyone who reaches this address can sign in as the site admin. Unset GRISAILLE_DEMO for real use.\n${bar}`);
  }
  if (ctx.env.publicUrl.startsWith('https:') && ctx.env.trustProxy === false) {
    console.warn('PUBLIC_URL is https but TRUST_PROXY is not set: behind a proxy that ends TLS, the app sees plain http and will not set its Secure session cookie, so sign-ins will not stick. Set TRUST_PROXY (e.g. 1 for one proxy in front, or its address).');
  }
  if (!ctx.env.demo && !ctx.env.smtp) console.warn('SMTP_HOST is not set: invitation and reset mails are kept in the database, not sent. Set SMTP_HOST (and SMTP_PORT, SMTP_USER, SMTP_PASS).');
  console.log(`Grisaille is up on http://localhost:${ctx.env.port} (data in ${ctx.env.dataDir}; ready in ${Date.now() - started} ms)`);
  if (ctx.env.demo) {
    console.log(seeded ? 'Demo production seeded (invented data).' : 'Demo data already present.');
    console.log(`Demo sign-ins, password "${DEMO_PASSWORD}":`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(32)} ${a.note}`);
  }
  // the colour estimate's table: read from DATA_DIR/cache, or built once (a few seconds) before the first board asks
  const t0 = Date.now();
  getUpsampleTable(ctx.env.dataDir).then(
    () => console.log(`Colour estimate table ready (${Date.now() - t0} ms).`),
    (e: unknown) => console.error('Could not prepare the colour estimate table:', e),
  );
});
applyServerTimeouts(server);
const stop = () => {
  server.close();
  ctx.ds.destroy().finally(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
