import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const { version } = require('typescript/package.json') as { version: string };

/**
 * Names the checker as stored with a revision (`TypeScript 5.9.3`). Read from the package's
 * manifest, so a process that only compares it need not load the compiler itself.
 */
export const typeCheckerName = `TypeScript ${version}`;
