import type { Random } from '@sandbox/matrices/random.ts';
import type { MatrixProperties } from '@sandbox/matrices/reference-matrix.ts';

/** One numeric parameter of a family: its default and its allowed values. */
export interface ParamRule {
  default: number;
  /** Returns a message when value (already known to be finite) is not allowed. */
  check?: (value: number) => string | undefined;
}

/** Size and parameters after validation and defaults. */
export interface FamilyArgs {
  n: number;
  /** Rows; equals n unless the family is rectangular. */
  m: number;
  params: Readonly<Record<string, number>>;
}

/** What a family's builder gets: the arguments and the family's own seeded stream. */
export interface FamilyInput extends FamilyArgs {
  random: Random;
}

/** symmetric and upperTriangular are read off the stored bits by generateMatrix. */
export type FamilyProperties = Omit<MatrixProperties, 'symmetric' | 'upperTriangular'>;

/** A builder's result: entry (i, j) of the m×n matrix at data[i*n + j]. */
export interface FamilyOutput {
  data: Float64Array;
  properties: FamilyProperties;
}

/** How generateMatrix validates and builds one family. */
export interface FamilyDefinition {
  /** Whether the seed changes the matrix (random families). */
  seeded: boolean;
  /** Whether m may differ from n. */
  rectangular: boolean;
  params: Readonly<Record<string, ParamRule>>;
  /** Checks n, m and params together; returns a message naming the problem. */
  check?: (args: FamilyArgs) => string | undefined;
  build(input: FamilyInput): FamilyOutput;
}
