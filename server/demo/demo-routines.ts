import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';
import type { MatrixSetItemInput } from '@shared/api/matrix-sets.ts';
import type { RoutineSlug } from '@shared/routines.ts';

export type DemoRoutineKey = 'lu' | 'cholesky' | 'back-substitution';

export interface DemoRoutine {
  key: DemoRoutineKey;
  slug: string;
  title: string;
  description: string;
  contract: RoutineSlug;
  policy: Partial<AcceptancePolicy>;
  set: {
    name: string;
    description: string;
    /** Small sizes and a small timing budget keep the whole demo load short. */
    timingSizes: number[];
    items: Extract<MatrixSetItemInput, { kind: 'generated' }>[];
    /** Whether the uploaded stiffness matrices (frame-models.ts) join the set. */
    withStiffnessUploads: boolean;
  };
}

const g = (
  family: string,
  n: number,
  extra: { seed?: number; params?: Record<string, number> } = {},
): Extract<MatrixSetItemInput, { kind: 'generated' }> => ({
  kind: 'generated',
  family,
  n,
  ...extra,
});

/**
 * The team's three routines. The allowed slowdown is wider than the default: at these small
 * timing sizes the interleaved medians of two equally fast kernels differ by up to about 20 % on
 * a busy two-core machine, and the team would rather read the timing than be blocked by it.
 */
export const demoRoutines: readonly DemoRoutine[] = [
  {
    key: 'lu',
    slug: 'frame-lu',
    title: 'Frame solver: LU with partial pivoting',
    description:
      'Factors the unsymmetric tangent matrices of the nonlinear frame solver (follower loads, P-delta terms).',
    contract: 'lu-partial-pivoting',
    policy: { allowedSlowdown: 0.25 },
    set: {
      name: 'Frame solver — general',
      description:
        'Random and classic test matrices, an ill-conditioned one, worst-case growth, a matrix that needs row exchanges and a singular one that must be refused.',
      timingSizes: [32, 64],
      items: [
        g('uniform', 16, { seed: 11 }),
        g('normal', 24, { seed: 12 }),
        g('diagonally-dominant', 16, { seed: 13 }),
        g('hilbert', 8),
        g('frank', 10),
        g('worst-growth', 12),
        g('prescribed-condition', 24, { seed: 14, params: { cond: 1e8 } }),
        g('needs-row-exchange', 6, { params: { pivot: 0 } }),
        g('singular', 6),
      ],
      withStiffnessUploads: false,
    },
  },
  {
    key: 'cholesky',
    slug: 'stiffness-cholesky',
    title: 'Stiffness solver: Cholesky',
    description:
      'Factors the assembled, supported stiffness matrices of the linear static analysis. Two sign-offs are needed: a wrong factor here goes straight into member forces.',
    contract: 'cholesky',
    policy: { allowedSlowdown: 0.25, signOffsRequired: 2 },
    set: {
      name: 'Stiffness — frames and SPD families',
      description:
        'The access-tower frame stiffness matrices uploaded from our own models, SPD test families, and an indefinite matrix that must be refused.',
      timingSizes: [32, 64],
      items: [
        g('spd-random', 16, { seed: 21 }),
        g('spd-random', 32, { seed: 22 }),
        g('hilbert', 8),
        g('lehmer', 12),
        g('minij', 16),
        g('poisson-1d', 20),
        g('indefinite', 10),
      ],
      withStiffnessUploads: true,
    },
  },
  {
    key: 'back-substitution',
    slug: 'triangular-solve',
    title: 'Triangular solve: back substitution',
    description:
      'Solves with the U factor for every load case once the stiffness or tangent matrix is factored.',
    contract: 'back-substitution',
    policy: { allowedSlowdown: 0.25 },
    set: {
      name: 'Triangular — U factors',
      description:
        'Upper factors of random, graded and ill-conditioned matrices, a Kahan matrix, and a singular one whose zero diagonal must be refused.',
      timingSizes: [64, 128],
      items: [
        g('uniform', 16, { seed: 31 }),
        g('normal', 24, { seed: 32 }),
        g('graded', 12, { seed: 33 }),
        g('kahan', 12),
        g('prescribed-condition', 20, { seed: 34, params: { cond: 1e10 } }),
        g('singular', 6),
      ],
      withStiffnessUploads: false,
    },
  },
];
