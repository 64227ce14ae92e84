import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBundledProbe } from '@tests/helpers/bundled-probe.ts';

// The built server bundles its code into dist/server/*.js with npm packages left external
// (scripts/build-server.mjs); the type-check thread's entry is bundled beside it. This builds a
// small entry the same way into a scratch folder under dist/ (so node_modules resolves) and
// runs it with plain node, without tsx.
const probe = `
import { createTypeCheckPool } from ${JSON.stringify(resolve('sandbox/isolate/type-check-pool.ts'))};
const pool = createTypeCheckPool({ threads: 1 });
const outcome = await pool.check('export function factor(a: Float64Array, n: string) { return { lu: a, perm: new Int32Array(0) }; }', 'lu-partial-pivoting');
await pool.close();
console.log(JSON.stringify(outcome));
`;

describe('the type-check pool in a bundled build', () => {
  it('starts its thread from the bundled entry and answers with diagnostics', async () => {
    const stdout = await runBundledProbe({
      name: 'type-check-probe',
      probe,
      entries: { 'type-check-worker': 'sandbox/isolate/type-check-worker.ts' },
    });
    const outcome = JSON.parse(stdout) as { diagnostics: { code: string }[]; checkedWith: string };
    expect(outcome.diagnostics.map((d) => d.code)).toEqual(['TS2322']);
    expect(outcome.checkedWith).toMatch(/^TypeScript /);
  }, 60_000);
});
