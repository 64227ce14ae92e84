import { z } from 'zod';
import { MAX_ORDER, matrixId, resolveMatrixSpec } from '@sandbox/matrices/generate.ts';
import { quickItems, standardItems } from '@sandbox/matrices/named-set-items.ts';
import type { MatrixSpec } from '@sandbox/matrices/reference-matrix.ts';
import { familySlugs } from '@sandbox/matrices/reference-matrix.ts';

/** One matrix of a set: a generated recipe or an uploaded Matrix Market file (read by the caller). */
export type MatrixSetItem =
  { kind: 'generated'; spec: MatrixSpec } | { kind: 'file'; path: string };

/** A named list of reference matrices plus the sizes at which timing runs. */
export interface MatrixSet {
  name: string;
  items: MatrixSetItem[];
  timingSizes: number[];
}

export type NamedSetName = 'quick' | 'standard';

/** A built-in matrix set (a fresh copy each call). */
export function namedSet(name: NamedSetName): MatrixSet {
  const copy = (items: MatrixSetItem[]) => items.map((item) => structuredClone(item));
  if (name === 'quick') return { name, items: copy(quickItems), timingSizes: [16, 32] };
  if (name === 'standard')
    return { name, items: copy(standardItems), timingSizes: [64, 128, 256, 512] };
  throw new RangeError(`name must be 'quick' or 'standard', got ${String(name)}`);
}

const order = z.number().int().min(1).max(MAX_ORDER);

/** One entry of a matrix set given as JSON: a generated recipe, a file, or the timing sizes. */
export const matrixSetEntrySchema = z.union([
  z.strictObject({
    family: z.enum(familySlugs),
    n: order,
    m: z.number().int().min(1).optional(),
    seed: z.number().int().min(0).max(0xffffffff).optional(),
    params: z.record(z.string(), z.number().finite()).optional(),
  }),
  z.strictObject({
    file: z
      .string()
      .min(1)
      .regex(/\.mtx$/i, 'must name a Matrix Market file (.mtx)')
      .refine((p) => !p.startsWith('/') && !p.split(/[\\/]/).includes('..') && !p.includes('\0'), {
        message: 'must be a relative path without ".." segments',
      }),
  }),
  z.strictObject({ timing: z.array(order).min(1) }),
]);

/** A matrix set given as JSON: an array of entries, at most one of them a timing entry. */
export const matrixSetJsonSchema = z.array(matrixSetEntrySchema);

function describeIssues(error: z.ZodError): string {
  return error.issues
    .map((i) => (i.path.length ? `${i.path.join('.')}: ${i.message}` : i.message))
    .join(', ');
}

/** Parses a set given as JSON, or returns every problem, each naming the entry index. */
export function checkMatrixSetJson(
  value: unknown,
  name: string,
): { ok: true; set: MatrixSet } | { ok: false; problems: string[] } {
  if (!Array.isArray(value))
    return { ok: false, problems: ['the set must be a JSON array of entries'] };
  const problems: string[] = [];
  const items: MatrixSetItem[] = [];
  const seen = new Map<string, number>();
  let timingSizes: number[] | undefined;
  value.forEach((raw: unknown, index) => {
    const parsed = matrixSetEntrySchema.safeParse(raw);
    if (!parsed.success) {
      problems.push(`entry ${index}: ${describeIssues(parsed.error)}`);
      return;
    }
    const entry = parsed.data;
    let key: string;
    if ('timing' in entry) {
      if (timingSizes) problems.push(`entry ${index}: only one timing entry is allowed`);
      timingSizes = [...new Set(entry.timing)].sort((a, b) => a - b);
      return;
    } else if ('file' in entry) {
      key = `file ${entry.file}`;
      items.push({ kind: 'file', path: entry.file });
    } else {
      try {
        key = matrixId(resolveMatrixSpec(entry));
      } catch (error) {
        problems.push(`entry ${index}: ${(error as Error).message}`);
        return;
      }
      items.push({ kind: 'generated', spec: entry });
    }
    const previous = seen.get(key);
    if (previous !== undefined) problems.push(`entry ${index}: repeats entry ${previous} (${key})`);
    else seen.set(key, index);
  });
  if (problems.length) return { ok: false, problems };
  return { ok: true, set: { name, items, timingSizes: timingSizes ?? [] } };
}

/**
 * Parses a set given as JSON: an array of `{ family, n, m?, seed?, params? }`, `{ file }` and at
 * most one `{ timing: [sizes] }` (no timing entry means no timing). Unknown keys, bad values and
 * repeated matrices throw a RangeError listing every problem with its entry index.
 */
export function parseMatrixSetJson(value: unknown, name: string): MatrixSet {
  const result = checkMatrixSetJson(value, name);
  if (!result.ok)
    throw new RangeError(`matrix set "${name}" is invalid: ${result.problems.join('; ')}`);
  return result.set;
}
