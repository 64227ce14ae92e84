import { execFile } from 'node:child_process';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { build } from 'esbuild';
import { afterAll, describe, expect, it } from 'vitest';

// The built server bundles its code into dist/server/*.js with npm packages left external
// (scripts/build-server.mjs), the trial process's entry (trial-child.js) beside the worker. This
// bundles a small entry that starts a trial process the same way into a scratch folder under
// dist/ (so node_modules resolves) and runs it with plain node, without tsx: the process must
// start from the bundled trial-child.js and run a trial.
const scratch = resolve('dist', `trial-process-probe-${process.pid}`);
const probe = `
import { createTrialProcess } from ${JSON.stringify(resolve('sandbox/trial-process/trial-process.ts'))};
import { readKernelSource } from ${JSON.stringify(resolve('sandbox/kernels/read-kernel-source.ts'))};
import { generateMatrix } from ${JSON.stringify(resolve('sandbox/matrices/generate.ts'))};
const trials = createTrialProcess({ deadlineMs: 120_000, memoryMb: 1024 });
const source = readKernelSource('examples/lu-partial-pivoting-right-looking.ts', new URL(${JSON.stringify(`file://${resolve('sandbox/kernels')}/`)}));
const report = await trials.run({
  routine: 'lu-partial-pivoting',
  candidateSource: source,
  setName: 'probe',
  matrices: [generateMatrix({ family: 'hilbert', n: 6 })],
  timingSizes: [],
});
await trials.close();
console.log(JSON.stringify({ status: report.status, statuses: report.matrices.map((m) => m.candidate.status) }));
`;

afterAll(() => rm(scratch, { recursive: true, force: true }));

describe('the trial process in a bundled build', () => {
  it('starts from the bundled entry beside the bundle that uses it and runs a trial', async () => {
    await mkdir(scratch, { recursive: true });
    await writeFile(join(scratch, 'probe.ts'), probe);
    await build({
      entryPoints: {
        probe: join(scratch, 'probe.ts'),
        'trial-child': 'sandbox/trial-process/trial-child.ts',
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
      '--no-node-snapshot',
      join(scratch, 'out', 'probe.js'),
    ]);
    expect(JSON.parse(stdout)).toEqual({ status: 'completed', statuses: ['ok'] });
  }, 120_000);
});
