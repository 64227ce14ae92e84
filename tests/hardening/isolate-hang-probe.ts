import { loadKernel } from '@sandbox/isolate/kernel-runner.ts';
import { lu } from '@tests/hardening/hostile-kernel-cases.ts';

/**
 * Run as its own process by isolate-hang.test.ts: one call of a kernel that chains closures over
 * 2 MB arrays, under a 300 ms call limit and a 32 MB heap. Prints the call's status as JSON.
 */
const source = lu(
  'let f = (): number => 0;\nfor (let i = 0; ; i++) {\n  const g = f;\n  const big = new Array<number>(1 << 18).fill(i);\n  f = () => g() + big.length;\n}',
);
const out = await loadKernel({
  source,
  routine: 'lu-partial-pivoting',
  limits: { callTimeoutMs: 300, loadTimeoutMs: 300, memoryMb: 32 },
});
if (!out.ok) throw new Error(out.message);
const call = await out.kernel.call({ a: new Float64Array(16).fill(1), m: 4, n: 4 });
out.kernel.dispose();
process.stdout.write(`${JSON.stringify({ status: call.status })}\n`);
process.exit(0);
