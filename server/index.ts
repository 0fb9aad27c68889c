import { createApp } from './app';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './db/seed';

const started = Date.now();
const { app, ctx, seeded } = await createApp();
const server = app.listen(ctx.env.port, (err?: Error) => {
  if (err) throw err;
  console.log(`Grisaille is up on http://localhost:${ctx.env.port} (data in ${ctx.env.dataDir}; ready in ${Date.now() - started} ms)`);
  if (ctx.env.demo) {
    console.log(seeded ? 'Demo production seeded (invented data).' : 'Demo data already present.');
    console.log(`Demo sign-ins, password "${DEMO_PASSWORD}":`);
    for (const a of DEMO_ACCOUNTS) console.log(`  ${a.email.padEnd(32)} ${a.note}`);
  }
});
const stop = () => {
  server.close();
  ctx.ds.destroy().finally(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
