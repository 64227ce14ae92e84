import { maxMessageChars } from '@sandbox/isolate/limits.ts';

/**
 * What a call returns from inside the isolate, copied out by value. Only the prelude builds it:
 * a plain object literal whose fields are strings or fresh typed arrays, so copying it out runs
 * no kernel code (isolated-vm copies results after the timeout has stopped applying, and a
 * getter that never returns would otherwise hang the host).
 */
export interface Envelope {
  /** ok; the kernel threw; a typed-array allocation failed; the result is unusable; no export. */
  s: 'ok' | 'threw' | 'oom' | 'invalid' | 'missing';
  m?: string;
  a?: Float64Array | Int32Array;
  b?: Float64Array | Int32Array;
}

/**
 * What the isolate needs to check a result's shape: field tuples [name, type, length, message
 * prefix], the message prefix for a non-object, the message for a Promise, and whether the
 * kernel returns its array itself. The wording comes from routine-signatures.ts.
 */
export interface CallPlan {
  f: [string, string, number, string][];
  o: string;
  p: string;
  bare: boolean;
}

/**
 * JavaScript run in each fresh context before the kernel's module. It captures the intrinsics
 * it uses before any kernel code can replace them, removes V8's `console` (so the kernel finds
 * no channel out), and returns [load, call, stage, runStaged, stagedResult] without touching the
 * global object. Everything here runs inside the isolate under the caller's timeout, including any
 * getter, Proxy trap or toString the kernel plants in its result or thrown value.
 * A kernel that returns a Promise is invalid output: kernels must be synchronous.
 */
export const inIsolatePrelude = `(function () {
  'use strict';
  const apply = Reflect.apply;
  const F64 = Float64Array;
  const I32 = Int32Array;
  const Str = String;
  const isArray = Array.isArray;
  const getProto = Object.getPrototypeOf;
  const setProto = Object.setPrototypeOf;
  const own = Object.getOwnPropertyDescriptor;
  const typedProto = getProto(Int8Array.prototype);
  const tagOf = own(typedProto, Symbol.toStringTag).get;
  const lengthOf = own(typedProto, 'length').get;
  const setFrom = typedProto.set;
  const slice = Str.prototype.slice;
  const rangeErrorProto = RangeError.prototype;
  const maxChars = ${maxMessageChars};
  delete globalThis.console;
  let kernel;
  let staged;
  let stagedResults;

  // Lists the prelude fills by index have no prototype: a kernel that plants a setter for '0'
  // on Array.prototype must not be able to swallow the staged inputs (and so time nothing).
  function list() {
    return setProto([], null);
  }

  function text(value) {
    let s;
    try {
      s = typeof value === 'string' ? value : Str(value);
    } catch (_) {
      s = 'a thrown value that cannot be turned into text';
    }
    return s.length > maxChars ? apply(slice, s, [0, maxChars]) + '…' : s;
  }

  function failure(e) {
    try {
      if (e !== null && typeof e === 'object' && getProto(e) === rangeErrorProto &&
          e.message === 'Array buffer allocation failed') return { s: 'oom' };
    } catch (_) {}
    return { s: 'threw', m: text(e) };
  }

  function tag(v) {
    return v !== null && typeof v === 'object' ? apply(tagOf, v, []) : undefined;
  }

  function describe(v) {
    if (v === null) return 'null';
    if (typeof v === 'function') return 'a function';
    if (typeof v !== 'object') return typeof v;
    const t = tag(v);
    if (t !== undefined) return t + ' of length ' + apply(lengthOf, v, []);
    return isArray(v) ? 'Array' : 'object';
  }

  function copyTyped(v) {
    const copy = tag(v) === 'Int32Array' ? new I32(apply(lengthOf, v, [])) : new F64(apply(lengthOf, v, []));
    apply(setFrom, copy, [v]);
    return copy;
  }

  function take(v, f) {
    if (tag(v) !== f[1] || apply(lengthOf, v, []) !== f[2]) return undefined;
    return copyTyped(v);
  }

  function collect(res, plan) {
    const fields = plan.f;
    const typed = tag(res) !== undefined;
    if (!typed && res !== null && typeof res === 'object' && typeof res.then === 'function') {
      return { s: 'invalid', m: plan.p };
    }
    if (plan.bare) {
      const x = take(res, fields[0]);
      return x === undefined ? { s: 'invalid', m: fields[0][3] + describe(res) } : { s: 'ok', a: x };
    }
    if (res === null || typeof res !== 'object' || typed) return { s: 'invalid', m: plan.o + describe(res) };
    const v0 = res[fields[0][0]];
    const c0 = take(v0, fields[0]);
    if (c0 === undefined) return { s: 'invalid', m: fields[0][3] + describe(v0) };
    if (fields.length < 2) return { s: 'ok', a: c0 };
    const v1 = res[fields[1][0]];
    const c1 = take(v1, fields[1]);
    if (c1 === undefined) return { s: 'invalid', m: fields[1][3] + describe(v1) };
    return { s: 'ok', a: c0, b: c1 };
  }

  function load(factory, exportName) {
    const module = { exports: {} };
    try {
      apply(factory, undefined, [module, module.exports]);
    } catch (e) {
      return failure(e);
    }
    let fn;
    try {
      const ex = module.exports;
      fn = ex === null || ex === undefined ? undefined : ex[exportName];
    } catch (e) {
      return failure(e);
    }
    if (typeof fn !== 'function') {
      return { s: 'missing', m: 'The kernel does not export a function named ' + exportName + ' (found ' + describe(fn) + ')' };
    }
    kernel = fn;
    return { s: 'ok' };
  }

  function call(inputs, plan) {
    let res;
    try {
      res = apply(kernel, undefined, inputs);
    } catch (e) {
      return failure(e);
    }
    try {
      return collect(res, plan);
    } catch (e) {
      return { s: 'invalid', m: 'reading the result failed: ' + text(e) };
    }
  }

  function cloneArgs(inputs) {
    const c = (v) => (typeof v === 'object' ? copyTyped(v) : v);
    return inputs.length === 3 ? [c(inputs[0]), c(inputs[1]), c(inputs[2])] : [c(inputs[0]), c(inputs[1])];
  }

  function stage(inputs, repeat) {
    try {
      const copies = list();
      for (let k = 0; k < repeat; k++) copies[k] = cloneArgs(inputs);
      staged = copies;
      stagedResults = undefined;
      return { s: 'ok' };
    } catch (e) {
      return failure(e);
    }
  }

  function runStaged() {
    const copies = staged;
    const results = list();
    staged = undefined;
    for (let k = 0; k < copies.length; k++) {
      try {
        results[k] = apply(kernel, undefined, copies[k]);
      } catch (e) {
        return failure(e);
      }
    }
    stagedResults = results;
    return { s: 'ok' };
  }

  // After timing, outside the timed step: the result of timed call k, collected like a call's,
  // so the host can check that the kernel did its work while it was timed.
  function stagedResult(plan, k) {
    const results = stagedResults;
    if (results === undefined || k >= results.length) {
      return { s: 'invalid', m: 'the timed call left no result to check' };
    }
    try {
      return collect(results[k], plan);
    } catch (e) {
      return { s: 'invalid', m: 'reading the result failed: ' + text(e) };
    }
  }

  return [load, call, stage, runStaged, stagedResult];
})()`;
