import { lu } from '@tests/hardening/hostile-kernel-cases.ts';

/**
 * An lu-partial-pivoting kernel whose `factor` chains closures over 2 MB arrays. It drives its
 * isolate to the heap limit in a way that neither the call timeout nor Isolate.dispose() ends
 * (isolated-vm 5.0.4, Node 20): the call never settles, the process's resident memory keeps
 * growing past the isolate's limit (about 100 MB/s here), and at times the process's main thread
 * stalls too. Only killing the process stops it; isolate-hang.test.ts checks that the trial
 * process does so and that the trial ends as the kernel's failure.
 */
export const closureChainHog = lu(
  'let f = (): number => 0;\nfor (let i = 0; ; i++) {\n  const g = f;\n  const big = new Array<number>(1 << 18).fill(i);\n  f = () => g() + big.length;\n}',
);
