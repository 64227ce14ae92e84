import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

/** How to start the trial process: its entry module, Node flags and working directory. */
export interface TrialChildEntry {
  modulePath: string;
  execArgv: string[];
  cwd: string;
}

/**
 * Node flags of every process that runs kernels (DEVELOPERS.md): isolated-vm needs the first on
 * Node 20; the second keeps V8 from leaving code in an isolate unoptimised, which fakes a slowdown.
 */
export const kernelProcessFlags = ['--no-node-snapshot', '--no-concurrent-recompilation'];

/**
 * Where the trial process's entry is, next to the module that starts it: from source (the dev
 * worker, tests, the evaluator: this file is a .ts module run through tsx) it is trial-child.ts,
 * loaded through tsx from the checkout's root, whose tsconfig.json maps the `@shared/` aliases;
 * in the production build (scripts/build-server.mjs bundles this module into
 * dist/server/worker.js) it is the bundle dist/server/trial-child.js, run by plain Node.
 * `fromUrl` is the starting module's URL (import.meta.url).
 */
export function resolveTrialChildEntry(fromUrl: string = import.meta.url): TrialChildEntry {
  const here = fileURLToPath(fromUrl);
  const dir = path.dirname(here);
  if (here.endsWith('.ts')) {
    return {
      modulePath: path.join(dir, 'trial-child.ts'),
      execArgv: [...kernelProcessFlags, '--import', 'tsx'],
      // sandbox/trial-process/ → the checkout's root.
      cwd: path.resolve(dir, '..', '..'),
    };
  }
  const modulePath = path.join(dir, 'trial-child.js');
  if (!existsSync(modulePath)) {
    throw new Error(
      `the trial process's bundle ${modulePath} is missing: run npm run build:server`,
    );
  }
  return { modulePath, execArgv: [...kernelProcessFlags], cwd: process.cwd() };
}
