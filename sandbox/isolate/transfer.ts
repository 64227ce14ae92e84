import type { RoutineSlug } from '@shared/routines.ts';
import {
  notAnObjectMessage,
  promiseMessage,
  routineSignatures,
  wrongFieldMessage,
} from '@sandbox/contracts/routine-signatures.ts';
import type { CallPlan, Envelope } from '@sandbox/isolate/in-isolate-prelude.ts';

/** One kernel call's input, on the host: A (U for back substitution) is m×n, row-major. */
export interface CallArgs {
  a: Float64Array;
  m: number;
  n: number;
  /** The right-hand side, for back substitution only. */
  b?: Float64Array;
}

function positiveInteger(name: string, v: number): void {
  if (!Number.isInteger(v) || v < 1)
    throw new RangeError(`${name} must be a positive integer, got ${v}`);
}

/**
 * The kernel's argument list for a routine (`[a, n]`, `[a, m, n]` or `[u, b, n]`), after
 * checking the host's arguments: bad arguments are the caller's mistake, so they throw
 * TypeError/RangeError naming the argument rather than becoming a call status.
 */
export function kernelArguments(routine: RoutineSlug, args: CallArgs): (Float64Array | number)[] {
  const { a, m, n, b } = args;
  if (!(a instanceof Float64Array)) throw new TypeError('args.a must be a Float64Array');
  positiveInteger('args.m', m);
  positiveInteger('args.n', n);
  if (a.length !== m * n)
    throw new RangeError(`args.a must have length m·n = ${m * n}, has ${a.length}`);
  const parameters = routineSignatures[routine].parameters;
  if (parameters === 'a, m, n') {
    if (m < n) throw new RangeError(`args.m must be at least args.n = ${n} for QR, got ${m}`);
    return [a, m, n];
  }
  if (m !== n) throw new RangeError(`args.m must equal args.n for ${routine}, got ${m} and ${n}`);
  if (parameters === 'a, n') return [a, n];
  if (!(b instanceof Float64Array))
    throw new TypeError('args.b must be a Float64Array for back substitution');
  if (b.length !== n) throw new RangeError(`args.b must have length n = ${n}, has ${b.length}`);
  return [a, b, n];
}

/** The shape checks the isolate runs on a result, with the host's wording (routine-signatures.ts). */
export function callPlan(routine: RoutineSlug, m: number, n: number): CallPlan {
  const sig = routineSignatures[routine];
  const fields = sig.fields(m, n);
  return {
    f: fields.map((f) => [f.name, f.type, f.rows * f.cols, wrongFieldMessage(f, '')]),
    o: notAnObjectMessage(sig.exportName, fields, ''),
    p: promiseMessage(sig.exportName),
    bare: sig.returnsArray,
  };
}

/**
 * Rebuilds, from a copied-out envelope, the value the kernel returned (its object of fields, or
 * its array for `solve`), for validate-result.ts to check again on the host.
 */
export function returnedValue(
  routine: RoutineSlug,
  envelope: Envelope,
  m: number,
  n: number,
): unknown {
  const sig = routineSignatures[routine];
  if (sig.returnsArray) return envelope.a;
  const [first, second] = sig.fields(m, n);
  const value: Record<string, unknown> = { [first!.name]: envelope.a };
  if (second) value[second.name] = envelope.b;
  return value;
}
