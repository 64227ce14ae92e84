import { execFile } from 'node:child_process';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { build } from 'esbuild';
import { afterAll, describe, expect, it } from 'vitest';

// The built server bundles its code into dist/server/*.js with npm packages left external
// (scripts/build-server.mjs); the type-check thread's entry is bundled beside it. This builds a
// small entry the same way into a scratch folder under dist/ (so node_modules resolves) and
// runs it with plain node, without tsx.
const scratch = resolve('dist', `type-check-probe-${process.pid}`);
const probe = `
import { createTypeCheckPool } from ${JSON.stringify(resolve('sandbox/isolate/type-check-pool.ts'))};
const pool = createTypeCheckPool({ threads: 1 });
const outcome = await pool.check('export function factor(a: Float64Array, n: string) { return { lu: a, perm: new Int32Array(0) }; }', 'lu-partial-pivoting');
await pool.close();
console.log(JSON.stringify(outcome));
`;

afterAll(() => rm(scratch, { recursive: true, force: true }));

describe('the type-check pool in a bundled build', () => {
  it('starts its thread from the bundled entry and answers with diagnostics', async () => {
    await mkdir(scratch, { recursive: true });
    await writeFile(join(scratch, 'probe.ts'), probe);
    await build({
      entryPoints: {
        probe: join(scratch, 'probe.ts'),
        'type-check-worker': 'sandbox/isolate/type-check-worker.ts',
      },
      outdir: join(scratch, 'out'),
      bundle: true,
      platform: 'node',
      format: 'esm',
      target: 'node20',
      packages: 'external',
      logLevel: 'silent',
      tsconfig: 'tsconfig.json',
    });
    const { stdout } = await promisify(execFile)(process.execPath, [
      join(scratch, 'out', 'probe.js'),
    ]);
    const outcome = JSON.parse(stdout) as { diagnostics: { code: string }[]; checkedWith: string };
    expect(outcome.diagnostics.map((d) => d.code)).toEqual(['TS2322']);
    expect(outcome.checkedWith).toMatch(/^TypeScript /);
  }, 60_000);
});
