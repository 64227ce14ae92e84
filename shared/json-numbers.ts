/**
 * JSON has no Infinity or NaN (RFC 8259 §6), yet a metric can be infinite (a residual of a
 * kernel's garbage). Reports therefore write non-finite numbers as the strings "Infinity",
 * "-Infinity" and "NaN", and read them back with `reviveNonFinite`.
 */
export function replaceNonFinite(_key: string, value: unknown): unknown {
  if (typeof value === 'number' && !Number.isFinite(value)) return String(value);
  return value;
}

export function reviveNonFinite(_key: string, value: unknown): unknown {
  if (value === 'Infinity') return Infinity;
  if (value === '-Infinity') return -Infinity;
  if (value === 'NaN') return NaN;
  return value;
}

export function stringifyWithNonFinite(value: unknown, space?: number): string {
  return JSON.stringify(value, replaceNonFinite, space);
}

export function parseWithNonFinite(text: string): unknown {
  return JSON.parse(text, reviveNonFinite);
}
