import { CholeskyDecomposition, Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { parseMatrixMarket } from '@sandbox/matrix-market/read.ts';
import { stiffnessFile, stiffnessModels } from '@server/demo/frame-models.ts';
import {
  assembleFrameStiffness,
  type FrameModel,
  type FrameSection,
} from '@server/demo/frame-stiffness.ts';

const section: FrameSection = { e: 200e9, area: 4e-3, inertia: 5e-5 };
const length = 3;
const ei = section.e * section.inertia;
const ea = section.e * section.area;

function dense(k: Float64Array, n: number): Matrix {
  return new Matrix(Array.from({ length: n }, (_, i) => Array.from(k.subarray(i * n, i * n + n))));
}

function cantilever(end: { x: number; y: number }): FrameModel {
  return {
    nodes: [
      { x: 0, y: 0, support: 'fixed' },
      { ...end, support: 'free' },
    ],
    members: [{ from: 0, to: 1, section }],
  };
}

function tipDisplacements(model: FrameModel, load: [number, number, number]): number[] {
  const { k, n } = assembleFrameStiffness(model);
  expect(n).toBe(3);
  return solve(dense(k, n), Matrix.columnVector(load)).to1DArray();
}

describe('frame stiffness', () => {
  // Tip of a cantilever under an end load P: deflection PL³/(3EI), rotation PL²/(2EI); under an
  // axial load, extension PL/(EA). Classical beam results (J. M. Gere and B. J. Goodno,
  // Mechanics of Materials, table of cantilever deflections, from memory); the member's
  // stiffness gives them exactly, as Euler–Bernoulli elements do for end loads.
  it('gives the cantilever results for a horizontal member', () => {
    const p = 1000;
    const [u, v, theta] = tipDisplacements(cantilever({ x: length, y: 0 }), [p, p, 0]);
    expect(u).toBeCloseTo((p * length) / ea, 15);
    expect(v! / ((p * length ** 3) / (3 * ei))).toBeCloseTo(1, 12);
    expect(theta! / ((p * length ** 2) / (2 * ei))).toBeCloseTo(1, 12);
  });

  it('turns a vertical member: a sideways tip load bends it, a vertical one stretches it', () => {
    const p = 1000;
    const [u, v] = tipDisplacements(cantilever({ x: 0, y: length }), [p, p, 0]);
    expect(u! / ((p * length ** 3) / (3 * ei))).toBeCloseTo(1, 12);
    expect(v! / ((p * length) / ea)).toBeCloseTo(1, 12);
  });

  it('leaves a rigid-body translation unresisted when nothing is supported', () => {
    const free: FrameModel = {
      nodes: [
        { x: 0, y: 0, support: 'free' },
        { x: 2, y: 1.5, support: 'free' },
      ],
      members: [{ from: 0, to: 1, section }],
    };
    const { k, n } = assembleFrameStiffness(free);
    expect(n).toBe(6);
    const forces = dense(k, n)
      .mmul(Matrix.columnVector([1, 2, 0, 1, 2, 0]))
      .to1DArray();
    const scale = Math.max(...Array.from(k, Math.abs));
    for (const f of forces) expect(Math.abs(f)).toBeLessThan(scale * 1e-12);
  });

  it('refuses a member of zero length', () => {
    const model: FrameModel = {
      nodes: [
        { x: 1, y: 1, support: 'fixed' },
        { x: 1, y: 1, support: 'free' },
      ],
      members: [{ from: 0, to: 1, section }],
    };
    expect(() => assembleFrameStiffness(model)).toThrow(RangeError);
  });

  it('assembles the demo frames into exactly symmetric, positive definite matrices', () => {
    const sizes = stiffnessModels.map((entry) => {
      const { k, n } = assembleFrameStiffness(entry.model);
      for (let i = 0; i < n; i++)
        for (let j = 0; j < i; j++) expect(Object.is(k[i * n + j], k[j * n + i])).toBe(true);
      expect(new CholeskyDecomposition(dense(k, n)).isPositiveDefinite()).toBe(true);
      return n;
    });
    // Free degrees of freedom: portal 2 nodes × 3; 2 bays × 3 storeys 9 nodes × 3; the braced
    // frame 16 free nodes × 3 plus a rotation at each of its 4 pinned bases.
    expect(sizes).toEqual([6, 27, 52]);
  });

  it('writes each frame as a symmetric Matrix Market file that reads back bit for bit', () => {
    for (const entry of stiffnessModels) {
      const { k, n } = assembleFrameStiffness(entry.model);
      const parsed = parseMatrixMarket(stiffnessFile(entry).text);
      expect(parsed).toMatchObject({ m: n, n, symmetry: 'symmetric', field: 'real' });
      expect(Array.from(parsed.data)).toEqual(Array.from(k));
    }
  });
});
