import { describe, expect, it } from 'vitest';
import { compileKernel } from '@sandbox/isolate/compile.ts';

describe('compileKernel', () => {
  it('strips types and emits CommonJS that assigns module.exports', async () => {
    const out = await compileKernel(
      'interface P { n: number }\nexport function solve(u: Float64Array, b: Float64Array, n: number): Float64Array { const p: P = { n }; return p.n > 0 ? b : u; }',
    );
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.js).toContain('module.exports');
    expect(out.js).not.toMatch(/interface|: Float64Array/);
  });

  it('reports a syntax error at its 1-based line and column', async () => {
    const out = await compileKernel(
      'export function factor(a: Float64Array, n: number) {\n  return { lu: a, ;\n}',
    );
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.diagnostics).toHaveLength(1);
    // Line 2 is `  return { lu: a, ;`: the stray `;` is the 19th character.
    expect(out.diagnostics[0]).toMatchObject({
      line: 2,
      column: 19,
      code: 'syntax',
      file: 'kernel',
    });
  });

  it('refuses a source above the size limit before compiling it', async () => {
    const big = `export const pad = '${'x'.repeat(300)}';`;
    const out = await compileKernel(big, { maxSourceBytes: 200 });
    expect(out.ok).toBe(false);
    if (out.ok) return;
    expect(out.diagnostics[0]!.code).toBe('source-too-large');
    expect(out.diagnostics[0]!.message).toContain(`is ${big.length} bytes; the limit is 200 bytes`);
  });
});
