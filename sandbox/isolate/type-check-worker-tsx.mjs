// The type-check thread's entry when the code runs from source (tsx in development, vitest):
// a worker thread starts without the parent's loaders, so this plain module loads the
// TypeScript entry through tsx, with the project's path aliases. The built server uses
// dist/server/type-check-worker.js instead (scripts/build-server.mjs).
import { fileURLToPath } from 'node:url';
import { tsImport } from 'tsx/esm/api';

const entry = await tsImport('./type-check-worker.ts', {
  parentURL: import.meta.url,
  tsconfig: fileURLToPath(new URL('../../tsconfig.json', import.meta.url)),
});

export default entry.default;
