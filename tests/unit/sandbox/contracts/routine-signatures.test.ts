import { describe, expect, it } from 'vitest';
import { routineSlugs } from '@shared/routines.ts';
import { contractTexts } from '@shared/contracts/contract-texts.ts';
import { routineSignatures } from '@sandbox/contracts/routine-signatures.ts';

// The runner's view of each routine must agree with the contract text the author sees
// (product.md, "Routines and their contracts").
describe('routineSignatures', () => {
  it.each(routineSlugs)('%s matches its contract text', (routine) => {
    const sig = routineSignatures[routine];
    const text = contractTexts[routine];
    const declared = new RegExp(`export declare function ${sig.exportName}\\(([^)]*)\\)`).exec(
      text,
    );
    expect(declared).not.toBeNull();
    const names = declared![1]!.split(',').map((p) => p.split(':')[0]!.trim());
    expect(names.join(', ')).toBe(sig.parameters);
    for (const f of sig.fields(5, 4)) {
      expect(text).toContain(sig.returnsArray ? `): ${f.type};` : `${f.name}: ${f.type};`);
    }
  });

  it('gives QR an m×n q and every square routine n·n factors', () => {
    const [q, r] = routineSignatures['householder-qr'].fields(7, 3);
    expect([q!.rows * q!.cols, r!.rows * r!.cols]).toEqual([21, 9]);
    const [lu, perm] = routineSignatures['lu-partial-pivoting'].fields(4, 4);
    expect([lu!.rows * lu!.cols, perm!.rows * perm!.cols, perm!.type]).toEqual([
      16,
      4,
      'Int32Array',
    ]);
  });
});
