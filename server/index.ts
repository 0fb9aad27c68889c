import { createApp } from './app';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from './db/seed';
import { getUpsampleTable } from './services/upsample-table';

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
  // the colour estimate's table: read from DATA_DIR/cache, or built once (a few seconds) before the first board asks
  const t0 = Date.now();
  getUpsampleTable(ctx.env.dataDir).then(
    () => console.log(`Colour estimate table ready (${Date.now() - t0} ms).`),
    (e: unknown) => console.error('Could not prepare the colour estimate table:', e),
  );
});
const stop = () => {
  server.close();
  ctx.ds.destroy().finally(() => process.exit(0));
};
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
