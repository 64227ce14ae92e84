import { resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runBundledProbe } from '@tests/helpers/bundled-probe.ts';

// The built server bundles its code into dist/server/*.js with npm packages left external
// (scripts/build-server.mjs), the trial process's entry (trial-child.js) beside the worker. This
// bundles a small entry that starts a trial process the same way into a scratch folder under
// dist/ (so node_modules resolves) and runs it with plain node, without tsx: the process must
// start from the bundled trial-child.js and run a trial.
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

describe('the trial process in a bundled build', () => {
  it('starts from the bundled entry beside the bundle that uses it and runs a trial', async () => {
    const stdout = await runBundledProbe({
      name: 'trial-process-probe',
      probe,
      entries: { 'trial-child': 'sandbox/trial-process/trial-child.ts' },
      nodeArgs: ['--no-node-snapshot'],
    });
    expect(JSON.parse(stdout)).toEqual({ status: 'completed', statuses: ['ok'] });
  }, 120_000);
});
