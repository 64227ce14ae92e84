import { execFile } from 'node:child_process';
import { mkdir, rm, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { promisify } from 'node:util';
import { build } from 'esbuild';

/**
 * Bundles `probe` (TypeScript source) with the extra `entries` the way scripts/build-server.mjs
 * bundles the server (ESM for node20, npm packages external) into a scratch folder under dist/
 * (so node_modules resolves), runs the probe with plain node and `nodeArgs` (no tsx), and returns
 * its standard output. The scratch folder is removed afterwards, pass or fail.
 */
export async function runBundledProbe(options: {
  name: string;
  probe: string;
  entries: Record<string, string>;
  nodeArgs?: string[];
}): Promise<string> {
  const scratch = resolve('dist', `${options.name}-${process.pid}`);
  try {
    await mkdir(scratch, { recursive: true });
    await writeFile(join(scratch, 'probe.ts'), options.probe);
    await build({
      entryPoints: { probe: join(scratch, 'probe.ts'), ...options.entries },
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
      ...(options.nodeArgs ?? []),
      join(scratch, 'out', 'probe.js'),
    ]);
    return stdout;
  } finally {
    await rm(scratch, { recursive: true, force: true });
  }
}
