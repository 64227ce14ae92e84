import type { CallStatus } from '@shared/routines.ts';
import { soundLu } from '@tests/unit/sandbox/isolate/hostile-helpers.ts';

/**
 * Hostile lu-partial-pivoting kernels for hostile-kernels.test.ts. Each source type-checks
 * against the contract (casts through `any` where the hostility is in the types), so it reaches
 * the isolate through both the kernel runner and runTrial. `sound(a, n)` is the plain starter.
 */
export interface HostileKernel {
  name: string;
  source: string;
  /** When loading must fail: the stage, the status for stage `load`, and the message. */
  load?: { stage: 'compile' | 'type-check' | 'load'; status?: CallStatus; message: RegExp };
  /**
   * One call on an n×n input (default 4). A list of statuses is for heap hogs: whether V8 hits
   * the heap limit or the clock first depends on how fast it allocates on a busy machine.
   */
  call?: { n?: number; status: CallStatus | CallStatus[]; message?: RegExp };
  /** A second call at another size: for kernels that misbehave only on large inputs. */
  large?: { n: number; status: CallStatus | CallStatus[]; message?: RegExp };
  /** kernel.time on a 4×4 input with this repeat count (default 1). */
  time?: { repeat?: number; status: CallStatus | 'ok'; message?: RegExp };
}

const signature =
  'export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array }';

/** A kernel whose `factor` has `body`, after `top` (module top-level code) and `sound`. */
export const lu = (body: string, top = ''): string =>
  `${top}\n${soundLu()}\n${signature} {\n${body}\n}\n`;

const timeoutMessage = /^The kernel ran longer than the 300 ms limit and was stopped\.$/;
const loadTimeout = /^The kernel's module top level ran longer than the 300 ms limit/;
const oomMessage = /^The kernel went over the isolate's 32 MB memory limit\.$/;
/** A heap hog is stopped by the memory limit or, on a slow machine, by the clock. */
const hogStatus: CallStatus[] = ['out-of-memory', 'timeout'];
const hogMessage = new RegExp(`${oomMessage.source}|${timeoutMessage.source}`);

export const hostileKernels: HostileKernel[] = [
  // Endless loops and exhaustion.
  {
    name: 'an endless loop in the kernel',
    source: lu('for (;;) n += 1;'),
    call: { status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'an endless loop at module top level',
    source: lu('return sound(a, n);', 'let spin = 0;\nwhile (spin >= 0) spin += 1;'),
    load: { stage: 'load', status: 'timeout', message: loadTimeout },
  },
  {
    name: 'memory exhaustion by arrays of numbers',
    source: lu(
      'const keep: number[][] = [];\nfor (;;) keep.push(new Array<number>(1 << 21).fill(n + 0.5));',
    ),
    call: { status: hogStatus, message: hogMessage },
  },
  {
    name: 'memory exhaustion by flat strings',
    source: lu(
      'const keep: string[] = [];\nfor (let i = 0; ; i++) keep.push(new Array<string>(1 << 21).join(String.fromCharCode(65 + (i % 26))));',
    ),
    call: { status: hogStatus, message: hogMessage },
  },
  {
    name: 'memory exhaustion by closures',
    source: lu(
      'let f = (): number => 0;\nfor (let i = 0; ; i++) {\n  const g = f;\n  const big = new Array<number>(4096).fill(i);\n  f = () => g() + big.length;\n}',
    ),
    call: { status: hogStatus, message: hogMessage },
  },
  {
    name: 'memory exhaustion at module top level',
    source: lu(
      'return sound(a, n);',
      'const hoard: Float64Array[] = [];\nfor (;;) hoard.push(new Float64Array(1 << 20));',
    ),
    load: {
      stage: 'load',
      status: 'out-of-memory',
      message: /top level went over the isolate's 32 MB/,
    },
  },
  {
    name: 'a typed array over a huge buffer',
    source: lu(
      'const huge = new Float64Array(new ArrayBuffer(2 ** 33));\nreturn { lu: huge, perm: new Int32Array(n) };',
    ),
    call: { status: 'out-of-memory', message: oomMessage },
  },
  {
    name: 'a resizable buffer with an absurd maximum',
    source: lu(
      'const buf = new (ArrayBuffer as any)(8 * n * n, { maxByteLength: 2 ** 52 });\nreturn { lu: new Float64Array(buf), perm: new Int32Array(n) };',
    ),
    call: { status: 'threw', message: /RangeError/ },
  },
  {
    name: 'deep recursion',
    source: lu(
      'const depth = (k: number): number => depth(k + 1) + 1;\nreturn { lu: a, perm: new Int32Array(depth(n)) };',
    ),
    call: { status: 'threw', message: /^RangeError: Maximum call stack size exceeded$/ },
  },
  {
    name: 'deep recursion that catches the stack overflow and recurses again',
    source: lu(
      'const dig = (k: number): number => {\n  try {\n    return dig(k + 1) + 1;\n  } catch {\n    return dig(0);\n  }\n};\nreturn { lu: a, perm: new Int32Array(dig(n)) };',
    ),
    call: { status: 'timeout', message: timeoutMessage },
  },
  // Enormous and wrongly typed results.
  {
    name: 'an enormous result',
    source: lu('return { lu: new Float64Array(1 << 21), perm: sound(a, n).perm };'),
    call: {
      status: 'invalid-output',
      message: /^lu must be a Float64Array of length n·n = 16, got Float64Array of length 2097152$/,
    },
  },
  {
    name: 'lu as a plain Array',
    source: lu('const r = sound(a, n);\nreturn { lu: Array.from(r.lu) as any, perm: r.perm };'),
    call: {
      status: 'invalid-output',
      message: /^lu must be a Float64Array of length n·n = 16, got Array$/,
    },
  },
  {
    name: 'lu as a Float32Array',
    source: lu(
      'const r = sound(a, n);\nreturn { lu: Float32Array.from(r.lu) as any, perm: r.perm };',
    ),
    call: { status: 'invalid-output', message: /got Float32Array of length 16$/ },
  },
  {
    name: 'perm as a Float64Array',
    source: lu(
      'const r = sound(a, n);\nreturn { lu: r.lu, perm: Float64Array.from(r.perm) as any };',
    ),
    call: {
      status: 'invalid-output',
      message: /^perm must be an Int32Array of length n = 4, got Float64Array of length 4$/,
    },
  },
  {
    name: 'null instead of a result',
    source: lu('return null as any;'),
    call: { status: 'invalid-output', message: /got null$/ },
  },
  {
    name: 'a bigint instead of a result',
    source: lu('return BigInt(n) as any;'),
    call: { status: 'invalid-output', message: /got bigint$/ },
  },
  {
    name: 'a function instead of a result',
    source: lu('return (() => sound(a, n)) as any;'),
    call: { status: 'invalid-output', message: /got a function$/ },
  },
  {
    name: 'NaN in the factors',
    source: lu('const r = sound(a, n);\nr.lu[n + 1] = NaN;\nreturn r;'),
    call: { status: 'non-finite', message: /^lu\[1, 1\] = NaN: a non-finite number/ },
  },
  {
    name: 'a perm that is not a permutation',
    source: lu('const r = sound(a, n);\nr.perm.fill(0);\nreturn r;'),
    call: { status: 'invalid-output', message: /perm/ },
  },
  // Getters, proxies and conversion traps.
  {
    name: 'a getter on lu that never returns',
    source: lu(
      'const r = sound(a, n);\nreturn { get lu(): Float64Array { for (;;) n += 1; }, perm: r.perm };',
    ),
    call: { status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'a getter on lu that throws',
    source: lu(
      "const r = sound(a, n);\nreturn { get lu(): Float64Array { throw new Error('gotcha'); }, perm: r.perm };",
    ),
    call: { status: 'invalid-output', message: /^reading the result failed: Error: gotcha$/ },
  },
  {
    name: 'a getter that answers the check and the copy differently',
    source: lu(
      'const r = sound(a, n);\nlet reads = 0;\nreturn { get lu(): Float64Array { reads += 1; return reads === 1 ? r.lu : new Float64Array(n * n).fill(NaN); }, perm: r.perm };',
    ),
    call: { status: 'ok' },
  },
  {
    name: 'a Proxy around the lu array',
    source: lu('const r = sound(a, n);\nreturn { lu: new Proxy(r.lu, {}), perm: r.perm };'),
    call: {
      status: 'invalid-output',
      message: /^lu must be a Float64Array of length n·n = 16, got object$/,
    },
  },
  {
    name: 'a Proxy result whose traps throw',
    source: lu(
      "return new Proxy({} as { lu: Float64Array; perm: Int32Array }, { get() { throw new Error('trap'); }, has() { throw new Error('trap'); } });",
    ),
    call: { status: 'invalid-output', message: /^reading the result failed: Error: trap$/ },
  },
  {
    name: 'an object with valueOf, toString and Symbol.toPrimitive traps as lu',
    source: lu(
      'const r = sound(a, n);\nconst trap = { valueOf(): number { for (;;) n += 1; }, toString(): string { for (;;) n += 1; }, [Symbol.toPrimitive](): number { for (;;) n += 1; } };\nreturn { lu: trap as any, perm: r.perm };',
    ),
    call: { status: 'invalid-output', message: /got object$/ },
  },
  {
    name: 'a fake typed array (toStringTag and length of its own)',
    source: lu(
      "const r = sound(a, n);\nconst fake = { [Symbol.toStringTag]: 'Float64Array', length: n * n, buffer: r.lu.buffer };\nreturn { lu: fake as any, perm: r.perm };",
    ),
    call: { status: 'invalid-output', message: /got object$/ },
  },
  {
    name: 'a thenable result',
    source: lu('return { then: (): number => 1, lu: a, perm: new Int32Array(n) } as any;'),
    call: { status: 'invalid-output', message: /Promise/i },
  },
  {
    name: 'a promise that never settles',
    source: lu('return new Promise(() => {}) as any;'),
    call: { status: 'invalid-output', message: /Promise/i },
  },
  {
    name: 'an async kernel',
    source: lu('return (async () => sound(a, n))() as any;'),
    call: { status: 'invalid-output', message: /Promise/i },
  },
  // Thrown values that are not Errors.
  {
    name: 'throwing a number',
    source: lu('throw 42;'),
    call: { status: 'threw', message: /^42$/ },
  },
  {
    name: 'throwing undefined',
    source: lu('throw undefined;'),
    call: { status: 'threw', message: /^undefined$/ },
  },
  {
    name: 'throwing a Symbol',
    source: lu("throw Symbol('pivot');"),
    call: { status: 'threw', message: /^Symbol\(pivot\)$/ },
  },
  {
    name: 'throwing an object whose Symbol.toPrimitive throws',
    source: lu("throw { [Symbol.toPrimitive](): string { throw new Error('no'); } };"),
    call: { status: 'threw', message: /^a thrown value that cannot be turned into text$/ },
  },
  {
    name: 'throwing an Error whose message getter never returns',
    source: lu(
      "const e = new Error();\nObject.defineProperty(e, 'message', { get(): string { for (;;) n += 1; } });\nthrow e;",
    ),
    call: { status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'throwing a non-Error at module top level',
    source: lu('return sound(a, n);', "throw { toString: () => 'refusing to load' };"),
    load: {
      stage: 'load',
      status: 'threw',
      message: /^The kernel's module threw while loading: refusing to load$/,
    },
  },
  // SharedArrayBuffer and Atomics.
  {
    name: 'Atomics.wait on a SharedArrayBuffer',
    source: lu(
      'const cell = new Int32Array(new SharedArrayBuffer(4));\nAtomics.wait(cell, 0, 0);\nreturn sound(a, n);',
    ),
    call: { status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'factors returned in shared memory',
    source: lu(
      'const r = sound(a, n);\nconst shared = new Float64Array(new SharedArrayBuffer(8 * n * n));\nshared.set(r.lu);\nreturn { lu: shared, perm: r.perm };',
    ),
    call: { status: 'ok' },
  },
  // Tampering with built-ins to corrupt the harness's checks.
  {
    name: 'an Array.prototype setter that swallows the staged timing inputs',
    source: lu(
      'for (;;) n += 1;',
      "Object.defineProperty(Array.prototype, '0', { set() {}, get() { return undefined; }, configurable: true });",
    ),
    call: { status: 'timeout', message: timeoutMessage },
    time: { status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'a Float64Array.prototype length that lies',
    source: lu(
      'const r = sound(a, n);\nreturn { lu: r.lu.subarray(0, 3), perm: r.perm };',
      "Object.defineProperty(Float64Array.prototype, 'length', { get() { return 16; } });",
    ),
    call: { status: 'invalid-output', message: /got Float64Array of length 3$/ },
  },
  {
    name: 'typed-array set, subarray and Symbol.toStringTag replaced',
    source: lu(
      'return sound(a, n);',
      "const proto = Object.getPrototypeOf(Int8Array.prototype);\nproto.set = function () { throw new Error('set'); };\nFloat64Array.prototype.subarray = function () { return new Float64Array(1); } as any;\nObject.defineProperty(proto, Symbol.toStringTag, { get() { return 'Float64Array'; } });",
    ),
    call: { status: 'ok' },
  },
  {
    name: 'Math replaced with functions that lie',
    source: lu(
      'return sound(a, n);',
      '(Math as any).abs = (): number => 0;\n(Math as any).max = (): number => NaN;',
    ),
    call: { status: 'ok' },
  },
  {
    name: 'Object.prototype.then planted so every object looks like a promise',
    source: lu(
      'return sound(a, n);',
      "Object.defineProperty(Object.prototype, 'then', { get() { return () => 0; }, configurable: true });",
    ),
    call: { status: 'invalid-output', message: /Promise/i },
  },
  {
    name: 'String.prototype.slice and Reflect.apply replaced before a huge throw',
    source: lu(
      "throw 'y'.repeat(100_000);",
      "String.prototype.slice = () => 'z'.repeat(1_000_000);\n(Reflect as any).apply = () => { throw new Error('apply'); };",
    ),
    call: { status: 'threw', message: /^y{500}…$/ },
  },
  // Reaching the host.
  {
    name: 'process through globalThis',
    source: lu('(globalThis as any).process.exit(3);\nreturn sound(a, n);'),
    call: {
      status: 'threw',
      message: /^TypeError: Cannot read properties of undefined \(reading 'exit'\)$/,
    },
  },
  {
    name: 'require through globalThis',
    source: lu(
      "(globalThis as any).require('node:fs').writeFileSync('/tmp/stablehand-escaped', 'x');\nreturn sound(a, n);",
    ),
    call: { status: 'threw', message: /^TypeError: .*require is not a function$/ },
  },
  {
    name: "Function('return this') and the global's host objects",
    source: lu(
      "const g = Function('return this')();\nreturn g.process.mainModule.require('node:child_process') as any;",
    ),
    call: {
      status: 'threw',
      message: /^TypeError: Cannot read properties of undefined \(reading 'mainModule'\)$/,
    },
  },
  {
    name: 'a constructor chain to a Function that names process',
    source: lu(
      "const F = (a as any).constructor.constructor;\nreturn F('return process')().exit(1);",
    ),
    call: { status: 'threw', message: /^ReferenceError: process is not defined$/ },
  },
  {
    name: 'dynamic import of a Node module',
    source: lu("return import('node:fs') as any;"),
    load: { stage: 'type-check', message: /contract: 1 type error/ },
  },
  {
    name: 'dynamic import hidden from the type check',
    source: lu("const load = Function('s', 'return import(s)');\nreturn load('node:fs');"),
    call: { status: 'threw', message: /^The sandbox stopped the kernel: Not supported$/ },
  },
  {
    name: 'console and timers looked up on the global',
    source: lu(
      "const g = globalThis as any;\ng.console.log('hello host');\ng.setTimeout(() => 0, 1);\nreturn sound(a, n);",
    ),
    call: {
      status: 'threw',
      message: /^TypeError: Cannot read properties of undefined \(reading 'log'\)$/,
    },
  },
  // The clock, sizes and aliasing.
  {
    name: 'reading the clock to skip the work while timed',
    source: lu(
      'const now = Date.now();\nconst quick = now - last < 50;\nlast = now;\nif (quick) return { lu: a.subarray(1), perm: new Int32Array(0) };\nreturn sound(a, n);',
      'let last = -Infinity;',
    ),
    call: { status: 'ok' },
    time: {
      repeat: 3,
      status: 'invalid-output',
      message: /^While timed: lu must be a Float64Array of length n·n = 16/,
    },
  },
  {
    name: 'counting calls to return NaN on every timed call',
    source: lu(
      'calls += 1;\nconst r = sound(a, n);\nif (calls > 1) r.lu[0] = NaN;\nreturn r;',
      'let calls = 0;',
    ),
    call: { status: 'ok' },
    time: { status: 'non-finite', message: /^While timed: lu\[0, 0\] = NaN/ },
  },
  {
    name: 'an endless loop only on large inputs',
    source: lu('while (n > 8) n += 0;\nreturn sound(a, n);'),
    call: { status: 'ok' },
    large: { n: 10, status: 'timeout', message: timeoutMessage },
  },
  {
    name: 'a memory hog only on large inputs',
    source: lu(
      'const keep: Float64Array[] = [];\nwhile (n > 8) keep.push(new Float64Array(1 << 20));\nreturn sound(a, n);',
    ),
    call: { status: 'ok' },
    large: { n: 10, status: hogStatus, message: hogMessage },
  },
  {
    name: 'a wrong type only on large inputs',
    source: lu(
      'const r = sound(a, n);\nreturn n > 8 ? ({ lu: Array.from(r.lu), perm: r.perm } as any) : r;',
    ),
    call: { status: 'ok' },
    large: { n: 10, status: 'invalid-output', message: /got Array$/ },
  },
  {
    name: 'mutating the input after returning a view of it',
    source: lu(
      'const r = sound(a, n);\nPromise.resolve().then(() => a.fill(NaN));\nreturn { lu: new Float64Array(a.buffer, 0, n * n), perm: r.perm };',
    ),
    call: { status: 'ok' },
  },
  {
    name: 'keeping the previous input to corrupt it on the next call',
    source: lu(
      'if (kept) kept.fill(NaN);\nkept = a;\nreturn sound(a, n);',
      'let kept: Float64Array | null = null;',
    ),
    call: { status: 'ok' },
    large: { n: 5, status: 'ok' },
  },
  {
    name: 'perm aliasing the bytes of lu',
    source: lu(
      'const r = sound(a, n);\nreturn { lu: r.lu, perm: new Int32Array(r.lu.buffer, 0, n) };',
    ),
    call: { status: 'invalid-output', message: /perm/ },
  },
  {
    name: 'lu as a window into a larger buffer shared with perm',
    source: lu(
      'const r = sound(a, n);\nconst buf = new ArrayBuffer(8 * n * n + 4 * n);\nconst out = new Float64Array(buf, 0, n * n);\nout.set(r.lu);\nconst p = new Int32Array(buf, 8 * n * n, n);\np.set(r.perm);\nreturn { lu: out, perm: p };',
    ),
    call: { status: 'ok' },
  },
  // Source size.
  {
    name: 'an oversized source',
    source: lu('return sound(a, n);', `// ${'x'.repeat(210_000)}`),
    load: { stage: 'compile', message: /^The kernel does not compile\.$/ },
  },
];
