import { readFileSync } from 'node:fs';
import { pathToFileURL } from 'node:url';

// Beside this module when run from source; from the project folder when bundled (dist/server).
const here = new URL('./', import.meta.url);
const kernelsDirectory = here.pathname.endsWith('/sandbox/kernels/')
  ? here
  : new URL('sandbox/kernels/', pathToFileURL(`${process.cwd()}/`));

/**
 * Reads a kernel source shipped with the engine (an example or a starter) as text, by its path
 * relative to `sandbox/kernels/` (example-catalog.ts). `root` overrides the directory, for a
 * bundled build where this module no longer sits beside the files.
 */
export function readKernelSource(file: string, root: URL = kernelsDirectory): string {
  if (file.includes('..') || !file.endsWith('.ts')) {
    throw new RangeError(`file must be a .ts path inside sandbox/kernels/, got ${file}`);
  }
  return readFileSync(new URL(file, root), 'utf8');
}
