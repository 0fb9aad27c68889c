/**
 * `npm run bench`: runs every bench/*.bench.ts (each default-exports `run(record)`), prints each figure as
 * `name: value unit`, and writes them all to bench-results.json (ignored by git). Figures, not timed tests:
 * this machine is shared, so compare ratios measured in the same run.
 */
import fs from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

type Record = (name: string, value: number, unit: string) => void;
const figures: { name: string; value: number; unit: string; bench: string }[] = [];
const dir = path.dirname(new URL(import.meta.url).pathname);
const only = process.argv.slice(2);
const files = fs
  .readdirSync(dir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => only.length === 0 || only.some((o) => f.includes(o)))
  .sort();

for (const f of files) {
  const mod = (await import(pathToFileURL(path.join(dir, f)).href)) as { default: (r: Record) => Promise<void> };
  console.log(`# ${f}`);
  await mod.default((name, value, unit) => {
    const v = Number(value.toFixed(value < 10 ? 3 : 1));
    figures.push({ name, value: v, unit, bench: f });
    console.log(`${name}: ${v} ${unit}`);
  });
}
// a filtered run keeps the figures of the benches it did not run
let kept: typeof figures = [];
if (only.length && fs.existsSync('bench-results.json')) {
  try {
    kept = (JSON.parse(fs.readFileSync('bench-results.json', 'utf8')).figures as typeof figures).filter((f) => !files.includes(f.bench));
  } catch {
    kept = [];
  }
}
fs.writeFileSync('bench-results.json', JSON.stringify({ at: new Date().toISOString(), node: process.version, figures: [...kept, ...figures] }, null, 2));
console.log(`wrote bench-results.json (${figures.length} figures)`);
process.exit(0);
