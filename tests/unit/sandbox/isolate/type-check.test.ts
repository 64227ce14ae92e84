import { describe, expect, it } from 'vitest';
import { routineSlugs } from '@shared/routines.ts';
import { typeCheckKernel } from '@sandbox/isolate/type-check.ts';
import { readKernelSource } from '@sandbox/kernels/read-kernel-source.ts';
import { starterKernelFiles } from '@sandbox/kernels/starter-kernels.ts';

const lu = (body: string) => `export function factor(a: Float64Array, n: number) {\n${body}\n}\n`;

describe('typeCheckKernel', () => {
  it.each(routineSlugs)('finds nothing wrong with the %s starter', (routine) => {
    const out = typeCheckKernel(readKernelSource(starterKernelFiles[routine]), routine);
    expect(out.diagnostics).toEqual([]);
  });

  it('accepts a type-only import from the contract', () => {
    const source = `import type { LuFactors } from './contract';\nexport function factor(a: Float64Array, n: number): LuFactors {\n  return { lu: a, perm: new Int32Array(n) };\n}\n`;
    expect(typeCheckKernel(source, 'lu-partial-pivoting').diagnostics).toEqual([]);
  });

  it('reports a wrong signature at the line of the export, naming the contract', () => {
    const source = `// helper first\nconst two = 2;\nexport function factor(a: Float64Array, n: string) {\n  return { lu: a, perm: new Int32Array(two) };\n}\n`;
    const [d, ...rest] = typeCheckKernel(source, 'lu-partial-pivoting').diagnostics;
    expect(rest).toEqual([]);
    expect(d).toMatchObject({ line: 3, column: 17, code: 'TS2322', file: 'kernel' });
    expect(d!.message).toContain(
      '`factor` does not match the contract (factor(a: Float64Array, n: number): LuFactors)',
    );
    expect(d!.message).toContain("Types of parameters 'n' and 'n' are incompatible");
  });

  it('reports a result of the wrong type (a plain array for perm)', () => {
    const [d] = typeCheckKernel(
      lu('  return { lu: a, perm: [n] };'),
      'lu-partial-pivoting',
    ).diagnostics;
    expect(d!.line).toBe(1);
    expect(d!.message).toContain("The types of 'perm' are incompatible");
  });

  it('reports a missing export at line 1 with what the contract declares', () => {
    const source =
      'export function factorize(a: Float64Array, n: number) {\n  return { l: a.subarray(0, n * n) };\n}\n';
    expect(typeCheckKernel(source, 'cholesky').diagnostics).toEqual([
      {
        line: 1,
        column: 1,
        code: 'TS2339',
        file: 'kernel',
        message:
          'The kernel does not export `factor`; the contract declares factor(a: Float64Array, n: number): CholeskyFactor.',
      },
    ]);
  });

  it('reports a type error inside the body at its own line and column', () => {
    const source = lu(
      '  const perm = new Int32Array(n);\n  const label: string = n;\n  return { lu: a, perm, label };',
    );
    const diagnostics = typeCheckKernel(source, 'lu-partial-pivoting').diagnostics;
    expect(diagnostics).toHaveLength(1);
    expect(diagnostics[0]).toMatchObject({ line: 3, column: 9, code: 'TS2322', file: 'kernel' });
    expect(diagnostics[0]!.message).toBe("Type 'number' is not assignable to type 'string'.");
  });

  it('refuses imports of modules, and host names such as console', () => {
    const source = `import { readFileSync } from 'node:fs';\n${lu('  console.log(readFileSync);\n  return { lu: a, perm: new Int32Array(n) };')}`;
    const diagnostics = typeCheckKernel(source, 'lu-partial-pivoting').diagnostics;
    const codes = diagnostics.map((d) => `${d.line}:${d.code}`);
    expect(codes).toEqual(expect.arrayContaining(['1:kernel-import', '1:TS2307', '3:TS2584']));
    const consoleMessage = diagnostics.find((d) => d.code === 'TS2584')!.message;
    expect(consoleMessage).toContain("Cannot find name 'console': kernels run in a bare isolate");
  });

  it('refuses an oversized source without checking it', () => {
    const source = lu(`  return { lu: a, perm: new Int32Array(n) }; // ${'x'.repeat(400)}`);
    const out = typeCheckKernel(source, 'lu-partial-pivoting', { maxSourceBytes: 300 });
    expect(out.diagnostics.map((d) => d.code)).toEqual(['source-too-large']);
  });
});
