/**
 * Stiffness matrices of small plane frames, for the demo's uploaded Matrix Market files: each
 * member is a two-node Euler–Bernoulli beam-column with three degrees of freedom per node
 * (horizontal u, vertical v, rotation θ), its local stiffness turned into global axes and added
 * into the global K by the direct stiffness method; the degrees of freedom held by supports are
 * then removed, which leaves K symmetric positive definite for a frame that cannot move as a
 * rigid body. Method: W. McGuire, R. H. Gallagher and R. D. Ziemian, Matrix Structural Analysis,
 * 2nd ed., §4.4 (frame element) and §5.2 (transformation), from memory; the same element is in
 * J. S. Przemieniecki, Theory of Matrix Structural Analysis, ch. 5, from memory.
 */

/** A member's section and material: Young's modulus (Pa), area (m²), second moment of area (m⁴). */
export interface FrameSection {
  e: number;
  area: number;
  inertia: number;
}

/** `fixed` holds u, v and θ; `pinned` holds u and v; `free` holds nothing. */
export type FrameSupport = 'free' | 'pinned' | 'fixed';

export interface FrameNode {
  x: number;
  y: number;
  support: FrameSupport;
}

export interface FrameMember {
  from: number;
  to: number;
  section: FrameSection;
}

export interface FrameModel {
  nodes: readonly FrameNode[];
  members: readonly FrameMember[];
}

/** The assembled stiffness of the free degrees of freedom. */
export interface FrameStiffness {
  /** Dense row-major n×n: entry (i, j) at k[i*n + j]; exactly symmetric. */
  k: Float64Array;
  n: number;
  /** For each row of k: the node and which of u, v, θ it is. */
  dofs: { node: number; component: 'u' | 'v' | 'theta' }[];
}

const DOFS_PER_NODE = 3;
const components = ['u', 'v', 'theta'] as const;

/**
 * The 6×6 stiffness of one member in global axes, row-major, ordered (u₁, v₁, θ₁, u₂, v₂, θ₂).
 * Local stiffness: EA/L on the axial terms; 12EI/L³, 6EI/L², 4EI/L and 2EI/L on the bending
 * terms; global = Tᵀ·k_local·T with T the rotation by the member's angle at each node.
 * Throws RangeError for a member of zero length or a section that is not positive.
 */
export function frameMemberStiffness(
  start: { x: number; y: number },
  end: { x: number; y: number },
  section: FrameSection,
): Float64Array {
  const dx = end.x - start.x;
  const dy = end.y - start.y;
  const length = Math.hypot(dx, dy);
  if (!(length > 0)) throw new RangeError('a member must have a positive length');
  if (!(section.e > 0 && section.area > 0 && section.inertia > 0)) {
    throw new RangeError('section.e, section.area and section.inertia must be positive');
  }
  const c = dx / length;
  const s = dy / length;
  const axial = (section.e * section.area) / length;
  const ei = section.e * section.inertia;
  const b12 = (12 * ei) / length ** 3;
  const b6 = (6 * ei) / length ** 2;
  const b4 = (4 * ei) / length;
  const b2 = (2 * ei) / length;
  // prettier-ignore
  const local = [
    axial, 0, 0, -axial, 0, 0,
    0, b12, b6, 0, -b12, b6,
    0, b6, b4, 0, -b6, b2,
    -axial, 0, 0, axial, 0, 0,
    0, -b12, -b6, 0, b12, -b6,
    0, b6, b2, 0, -b6, b4,
  ];
  // T maps global (u, v, θ) at each node to local (axial, transverse, θ).
  const t = new Float64Array(36);
  for (const base of [0, 3]) {
    t[base * 6 + base] = c;
    t[base * 6 + base + 1] = s;
    t[(base + 1) * 6 + base] = -s;
    t[(base + 1) * 6 + base + 1] = c;
    t[(base + 2) * 6 + base + 2] = 1;
  }
  const kt = new Float64Array(36);
  for (let i = 0; i < 6; i++)
    for (let j = 0; j < 6; j++) {
      let sum = 0;
      for (let p = 0; p < 6; p++) sum += local[i * 6 + p]! * t[p * 6 + j]!;
      kt[i * 6 + j] = sum;
    }
  const global = new Float64Array(36);
  for (let i = 0; i < 6; i++)
    for (let j = 0; j <= i; j++) {
      let sum = 0;
      for (let p = 0; p < 6; p++) sum += t[p * 6 + i]! * kt[p * 6 + j]!;
      // Only the lower triangle is computed and mirrored, so the result is exactly symmetric.
      global[i * 6 + j] = sum;
      global[j * 6 + i] = sum;
    }
  return global;
}

function heldComponents(support: FrameSupport): readonly boolean[] {
  if (support === 'fixed') return [true, true, true];
  if (support === 'pinned') return [true, true, false];
  return [false, false, false];
}

/**
 * Assembles the global stiffness of a plane frame and keeps the rows and columns of the degrees
 * of freedom no support holds. Cost O(members + n²). Throws RangeError for a member whose end
 * is not a node. Whether the result is positive definite depends on the supports: a frame that
 * can still move as a rigid body gives a singular K.
 */
export function assembleFrameStiffness(model: FrameModel): FrameStiffness {
  const dofs: FrameStiffness['dofs'] = [];
  const index = new Int32Array(model.nodes.length * DOFS_PER_NODE).fill(-1);
  model.nodes.forEach((node, i) => {
    const held = heldComponents(node.support);
    for (let c = 0; c < DOFS_PER_NODE; c++) {
      if (held[c]) continue;
      index[i * DOFS_PER_NODE + c] = dofs.length;
      dofs.push({ node: i, component: components[c]! });
    }
  });
  const n = dofs.length;
  const k = new Float64Array(n * n);
  for (const member of model.members) {
    const start = model.nodes[member.from];
    const end = model.nodes[member.to];
    if (!start || !end)
      throw new RangeError(`member ${member.from}–${member.to} names a missing node`);
    const ke = frameMemberStiffness(start, end, member.section);
    const at = [member.from, member.to].flatMap((node) =>
      [0, 1, 2].map((c) => index[node * DOFS_PER_NODE + c]!),
    );
    for (let i = 0; i < 6; i++) {
      const row = at[i]!;
      if (row < 0) continue;
      for (let j = 0; j <= i; j++) {
        const col = at[j]!;
        if (col < 0) continue;
        const value = ke[i * 6 + j]!;
        // Add into the lower triangle of K only; mirrored below.
        if (row >= col) k[row * n + col]! += value;
        else k[col * n + row]! += value;
      }
    }
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) k[j * n + i] = k[i * n + j]!;
  return { k, n, dofs };
}
