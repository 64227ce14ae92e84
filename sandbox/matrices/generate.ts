import { diagonallyDominantFamily } from '@sandbox/matrices/diagonally-dominant.ts';
import type { FamilyDefinition } from '@sandbox/matrices/family-definition.ts';
import { frankFamily } from '@sandbox/matrices/frank.ts';
import { gradedFamily } from '@sandbox/matrices/graded.ts';
import { hilbertFamily } from '@sandbox/matrices/hilbert.ts';
import { indefiniteFamily } from '@sandbox/matrices/indefinite.ts';
import { kahanFamily } from '@sandbox/matrices/kahan.ts';
import { lehmerFamily } from '@sandbox/matrices/lehmer.ts';
import { minijFamily } from '@sandbox/matrices/minij.ts';
import { molerFamily } from '@sandbox/matrices/moler.ts';
import { nearOverflowFamily } from '@sandbox/matrices/near-overflow.ts';
import { nearUnderflowFamily } from '@sandbox/matrices/near-underflow.ts';
import { nearlySingularFamily } from '@sandbox/matrices/nearly-singular.ts';
import { needsRowExchangeFamily } from '@sandbox/matrices/needs-row-exchange.ts';
import { normalFamily } from '@sandbox/matrices/normal.ts';
import { pascalFamily } from '@sandbox/matrices/pascal.ts';
import { poisson1dFamily } from '@sandbox/matrices/poisson-1d.ts';
import { poisson2dFamily } from '@sandbox/matrices/poisson-2d.ts';
import { prescribedConditionFamily } from '@sandbox/matrices/prescribed-condition.ts';
import { createRandom, streamId } from '@sandbox/matrices/random.ts';
import type {
  FamilySlug,
  MatrixSpec,
  ReferenceMatrix,
} from '@sandbox/matrices/reference-matrix.ts';
import { familySlugs } from '@sandbox/matrices/reference-matrix.ts';
import { singularFamily } from '@sandbox/matrices/singular.ts';
import { spdRandomFamily } from '@sandbox/matrices/spd-random.ts';
import { tallRandomFamily } from '@sandbox/matrices/tall-random.ts';
import { uniformFamily } from '@sandbox/matrices/uniform.ts';
import { vandermondeFamily } from '@sandbox/matrices/vandermonde.ts';
import { worstGrowthFamily } from '@sandbox/matrices/worst-growth.ts';

/** Largest order n (and, for square families, m) that generateMatrix accepts. */
export const MAX_ORDER = 4096;

/** Seed used by seeded families when the spec gives none. */
export const DEFAULT_SEED = 1;

/** How each family is validated and built, by slug. */
export const familyDefinitions: Readonly<Record<FamilySlug, FamilyDefinition>> = {
  uniform: uniformFamily,
  normal: normalFamily,
  'diagonally-dominant': diagonallyDominantFamily,
  'spd-random': spdRandomFamily,
  'prescribed-condition': prescribedConditionFamily,
  hilbert: hilbertFamily,
  pascal: pascalFamily,
  lehmer: lehmerFamily,
  minij: minijFamily,
  moler: molerFamily,
  frank: frankFamily,
  kahan: kahanFamily,
  'worst-growth': worstGrowthFamily,
  'poisson-1d': poisson1dFamily,
  'poisson-2d': poisson2dFamily,
  vandermonde: vandermondeFamily,
  graded: gradedFamily,
  'near-overflow': nearOverflowFamily,
  'near-underflow': nearUnderflowFamily,
  'needs-row-exchange': needsRowExchangeFamily,
  singular: singularFamily,
  'nearly-singular': nearlySingularFamily,
  indefinite: indefiniteFamily,
  'tall-random': tallRandomFamily,
};

/** A spec after validation: every field present, every parameter given or defaulted. */
export interface ResolvedSpec {
  family: FamilySlug;
  n: number;
  m: number;
  /** The seed for seeded families, 0 for the others (which ignore it). */
  seed: number;
  params: Record<string, number>;
}

function isFamily(value: unknown): value is FamilySlug {
  return typeof value === 'string' && (familySlugs as readonly string[]).includes(value);
}

function checkOrder(name: string, value: unknown, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 1 || value > max)
    throw new RangeError(`${name} must be an integer from 1 to ${max}, got ${String(value)}`);
  return value;
}

/** Validates a spec and fills in defaults; throws RangeError naming the field and the rule broken. */
export function resolveMatrixSpec(spec: MatrixSpec): ResolvedSpec {
  if (!isFamily(spec.family))
    throw new RangeError(
      `family must be one of ${familySlugs.join(', ')}; got ${String(spec.family)}`,
    );
  const family = spec.family;
  const def = familyDefinitions[family];
  const n = checkOrder('n', spec.n, MAX_ORDER);
  let m = n;
  if (def.rectangular) m = spec.m === undefined ? 2 * n : checkOrder('m', spec.m, 4 * MAX_ORDER);
  else if (spec.m !== undefined && spec.m !== n)
    throw new RangeError(
      `m must equal n for the square family ${family}, got m = ${spec.m}, n = ${n}`,
    );
  let seed = 0;
  if (def.seeded) {
    seed = spec.seed ?? DEFAULT_SEED;
    if (!Number.isInteger(seed) || seed < 0 || seed > 0xffffffff)
      throw new RangeError(`seed must be an integer from 0 to 4294967295, got ${seed}`);
  }
  const params: Record<string, number> = {};
  const given = spec.params ?? {};
  for (const key of Object.keys(given)) {
    if (!Object.hasOwn(def.params, key)) {
      const known = Object.keys(def.params);
      throw new RangeError(
        `params.${key} is not a parameter of ${family} (${known.length ? `it takes ${known.join(', ')}` : 'it takes none'})`,
      );
    }
  }
  for (const [key, rule] of Object.entries(def.params)) {
    const value = Object.hasOwn(given, key) ? given[key] : rule.default;
    if (typeof value !== 'number' || !Number.isFinite(value))
      throw new RangeError(`params.${key} must be a finite number, got ${String(value)}`);
    const problem = rule.check?.(value);
    if (problem) throw new RangeError(`params.${key}: ${problem}, got ${value}`);
    params[key] = value;
  }
  const problem = def.check?.({ n, m, params });
  if (problem) throw new RangeError(problem);
  return { family, n, m, seed, params };
}

function formatNumber(value: number): string {
  const plain = String(value);
  return plain.length <= 8 ? plain : value.toExponential().replace('e+', 'e');
}

/**
 * The stable id of a resolved spec: family and n, then m for rectangular families, the seed for
 * seeded ones, and each parameter that differs from its default (in declaration order), e.g.
 * `hilbert-n8`, `uniform-n64-s3`, `worst-growth-n40-alpha0.5`, `tall-random-n32-m64-s1`.
 */
export function matrixId(spec: ResolvedSpec): string {
  const def = familyDefinitions[spec.family];
  let id = `${spec.family}-n${spec.n}`;
  if (def.rectangular) id += `-m${spec.m}`;
  if (def.seeded) id += `-s${spec.seed}`;
  for (const [key, rule] of Object.entries(def.params))
    if (spec.params[key] !== rule.default) id += `-${key}${formatNumber(spec.params[key]!)}`;
  return id;
}

function isSymmetric(a: Float64Array, m: number, n: number): boolean {
  if (m !== n) return false;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < i; j++) if (a[i * n + j] !== a[j * n + i]) return false;
  return true;
}

function isUpperTriangular(a: Float64Array, m: number, n: number): boolean {
  for (let i = 1; i < m; i++)
    for (let j = 0; j < Math.min(i, n); j++) if (a[i * n + j] !== 0) return false;
  return true;
}

/**
 * Builds the matrix a spec describes: the same spec gives the same bits on every machine (seeded
 * families draw from createRandom(seed, streamId(family))). Layout: row-major m×n, entry (i, j) at
 * data[i*n + j]. Throws RangeError for a bad spec (see resolveMatrixSpec). Symmetry and upper
 * triangularity are read off the stored bits.
 */
export function generateMatrix(spec: MatrixSpec): ReferenceMatrix {
  const resolved = resolveMatrixSpec(spec);
  const def = familyDefinitions[resolved.family];
  const random = createRandom(resolved.seed, streamId(resolved.family));
  const { data, properties } = def.build({ ...resolved, random });
  const { m, n } = resolved;
  return {
    id: matrixId(resolved),
    family: resolved.family,
    m,
    n,
    seed: resolved.seed,
    params: resolved.params,
    data,
    properties: {
      ...properties,
      symmetric: isSymmetric(data, m, n),
      upperTriangular: isUpperTriangular(data, m, n),
    },
  };
}
