import { defineConfig } from 'vitest/config';

// Four suites, run by `npm test` (scripts/test.sh): unit, reference (against outside sources),
// api (the real app on a temporary SQLite file) and e2e (the built app in headless Chromium).
const decorators = { decorator: { legacy: true, emitDecoratorMetadata: true } };
// The spectral upsampling table, built once per run and read by the tests' `upsampleTable()` (see the file).
const upsampleTable = 'tests/setup/upsample-table.global.ts';

export default defineConfig({
  oxc: decorators as never,
  test: {
    projects: [
      { oxc: decorators as never, test: { name: 'unit', include: ['tests/unit/**/*.test.ts'], environment: 'node', globalSetup: [upsampleTable] } },
      { oxc: decorators as never, test: { name: 'reference', include: ['tests/reference/**/*.test.ts'], environment: 'node', testTimeout: 60_000, globalSetup: [upsampleTable] } },
      { oxc: decorators as never, test: { name: 'api', include: ['tests/api/**/*.test.ts'], environment: 'node', globalSetup: [upsampleTable], testTimeout: 30_000, hookTimeout: 60_000 } },
      { oxc: decorators as never, test: { name: 'e2e', include: ['tests/e2e/**/*.test.ts'], environment: 'node', globalSetup: [upsampleTable], testTimeout: 120_000, hookTimeout: 120_000, fileParallelism: false } },
    ],
  },
});
