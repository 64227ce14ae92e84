// Bundles the server entry points for production: our code bundled, npm packages left external.
import { build } from 'esbuild';

await build({
  entryPoints: {
    main: 'server/main.ts',
    migrate: 'server/db/migrate.ts',
    worker: 'server/worker.ts',
    // The worker's trial process: started by the worker from beside its own bundle.
    'trial-child': 'sandbox/trial-process/trial-child.ts',
    'fake-github': 'server/fake-github/main.ts',
    'fake-smtp': 'server/fake-smtp/main.ts',
    // Loaded by the type-check pool as a worker thread beside the bundle that uses it
    // (sandbox/isolate/type-check-pool.ts, typeCheckWorkerUrl).
    'type-check-worker': 'sandbox/isolate/type-check-worker.ts',
  },
  outdir: 'dist/server',
  bundle: true,
  platform: 'node',
  format: 'esm',
  target: 'node20',
  packages: 'external',
  sourcemap: true,
  logLevel: 'warning',
  tsconfig: 'tsconfig.json',
});
