/**
 * A kernel that looks for a way out of the sandbox instead of factoring (routine
 * lu-partial-pivoting). It never returns factors: it throws an Error listing what it found,
 * "host probe found nothing" when the isolate holds nothing of the host.
 * (Example kernel: what the engine must conclude about it is in example-catalog.ts.)
 */

/** Globals of ECMAScript 2022, ECMA-402 (Intl) and the WebAssembly JS API: all a bare V8 context holds. */
const languageGlobals = new Set(
  (
    'Object Function Array Number parseFloat parseInt Infinity NaN undefined Boolean String Symbol ' +
    'Date Promise RegExp Error AggregateError EvalError RangeError ReferenceError SyntaxError ' +
    'TypeError URIError globalThis JSON Math Intl ArrayBuffer Uint8Array Int8Array Uint16Array ' +
    'Int16Array Uint32Array Int32Array Float32Array Float64Array Uint8ClampedArray BigUint64Array ' +
    'BigInt64Array DataView Map BigInt Set WeakMap WeakSet Proxy Reflect FinalizationRegistry ' +
    'WeakRef decodeURI decodeURIComponent encodeURI encodeURIComponent escape unescape eval ' +
    'isFinite isNaN SharedArrayBuffer Atomics WebAssembly'
  ).split(' '),
);

const hostNames = [
  'process',
  'require',
  'module',
  'exports',
  'Buffer',
  'global',
  'console',
  'setTimeout',
  'setInterval',
  'setImmediate',
  'queueMicrotask',
  'fetch',
  'performance',
  'navigator',
  'ivm',
];

/**
 * import() needs a module loader, and the isolate has none. Tried at the top level so that the
 * promise has settled (microtasks run before the load returns) by the time factor reads it.
 */
let importOutcome = 'pending';
try {
  const loading = new Function('return import("node:fs")')() as Promise<unknown>;
  loading.then(
    () => (importOutcome = 'loaded'),
    () => (importOutcome = 'refused'),
  );
} catch {
  importOutcome = 'refused';
}

export function factor(a: Float64Array, n: number): { lu: Float64Array; perm: Int32Array } {
  const found: string[] = [];
  const global = globalThis as unknown as Record<string, unknown>;
  for (const name of hostNames) {
    if (global[name] !== undefined) found.push(name);
  }
  for (const name of Object.getOwnPropertyNames(globalThis)) {
    if (!languageGlobals.has(name) && !hostNames.includes(name)) found.push(name);
  }
  const viaFunction = new Function('return this')() as unknown;
  if (viaFunction !== globalThis) found.push('another global object via Function');
  const viaConstructor = (a.constructor.constructor as FunctionConstructor)(
    'return typeof process',
  )();
  if (viaConstructor !== 'undefined') found.push('process via the constructor chain');
  if (importOutcome !== 'refused') found.push(`import() ${importOutcome}`);
  const what = found.length === 0 ? 'nothing' : found.join(', ');
  throw new Error(`host probe found ${what} (n = ${n})`);
}
