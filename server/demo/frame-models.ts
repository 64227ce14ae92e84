import { writeMatrixMarket } from '@sandbox/matrix-market/write.ts';
import {
  assembleFrameStiffness,
  type FrameMember,
  type FrameModel,
  type FrameNode,
  type FrameSection,
} from './frame-stiffness.ts';

/**
 * The invented frames behind the demo team's uploaded stiffness matrices: the steel frames of a
 * fictional footbridge's access tower, in metres, pascals and m⁴. The sections are plausible
 * round numbers, not those of any catalogue.
 */
const steel = 210e9;
const column: FrameSection = { e: steel, area: 7.8e-3, inertia: 1.1e-4 };
const beam: FrameSection = { e: steel, area: 6.3e-3, inertia: 1.6e-4 };
const brace: FrameSection = { e: steel, area: 2.4e-3, inertia: 2.0e-6 };

/**
 * A regular frame of `bays` bays and `storeys` storeys: columns on every grid line, a beam on
 * every floor, base nodes fixed (or pinned), and optionally both diagonals in the bays listed.
 */
function gridFrame(options: {
  bayWidths: readonly number[];
  storeyHeights: readonly number[];
  base: 'fixed' | 'pinned';
  bracedBays?: readonly number[];
}): FrameModel {
  const xs = [0];
  for (const w of options.bayWidths) xs.push(xs[xs.length - 1]! + w);
  const ys = [0];
  for (const h of options.storeyHeights) ys.push(ys[ys.length - 1]! + h);
  const nodes: FrameNode[] = [];
  const at = (level: number, line: number) => level * xs.length + line;
  ys.forEach((y, level) =>
    xs.forEach((x) => nodes.push({ x, y, support: level === 0 ? options.base : 'free' })),
  );
  const members: FrameMember[] = [];
  for (let level = 1; level < ys.length; level++) {
    for (let line = 0; line < xs.length; line++) {
      members.push({ from: at(level - 1, line), to: at(level, line), section: column });
    }
    for (let bay = 0; bay < options.bayWidths.length; bay++) {
      members.push({ from: at(level, bay), to: at(level, bay + 1), section: beam });
      if (options.bracedBays?.includes(bay)) {
        members.push({ from: at(level - 1, bay), to: at(level, bay + 1), section: brace });
        members.push({ from: at(level - 1, bay + 1), to: at(level, bay), section: brace });
      }
    }
  }
  return { nodes, members };
}

export interface StiffnessModel {
  fileName: string;
  title: string;
  model: FrameModel;
}

/** The three frames, smallest first. */
export const stiffnessModels: readonly StiffnessModel[] = [
  {
    fileName: 'tower-portal.mtx',
    title: 'Access tower, single portal at the landing: 1 bay × 1 storey, fixed bases',
    model: gridFrame({ bayWidths: [6], storeyHeights: [4], base: 'fixed' }),
  },
  {
    fileName: 'tower-frame-2x3.mtx',
    title: 'Access tower, unbraced frame: 2 bays × 3 storeys, fixed bases',
    model: gridFrame({ bayWidths: [5, 5], storeyHeights: [4, 3.5, 3.5], base: 'fixed' }),
  },
  {
    fileName: 'tower-braced-3x4.mtx',
    title: 'Access tower, braced frame: 3 bays × 4 storeys, X-braced middle bay, pinned bases',
    model: gridFrame({
      bayWidths: [4.5, 3, 4.5],
      storeyHeights: [4, 3.5, 3.5, 3.5],
      base: 'pinned',
      bracedBays: [1],
    }),
  },
];

/** A stiffness model assembled and written as a symmetric Matrix Market file. */
export function stiffnessFile(entry: StiffnessModel): { fileName: string; text: string } {
  const { k, n } = assembleFrameStiffness(entry.model);
  const comment = [
    entry.title,
    'Invented demo data: global stiffness of a plane steel frame (N/m, N, N·m), supported',
    'degrees of freedom removed; symmetric positive definite.',
  ].join('\n');
  return {
    fileName: entry.fileName,
    text: writeMatrixMarket(k, n, n, { symmetry: 'symmetric', comment }),
  };
}
