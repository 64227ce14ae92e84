/** Number formats shared by the evaluator's text, the policy's reasons and the web pages (design.md). */

/** Errors and ratios in plain words: 31, 0.84, 2.3e+15, 1.1e-16; Infinity and NaN as words. */
export function formatValue(x: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? 'Infinity' : '-Infinity';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 0.01 && abs < 1e4) return String(Number(x.toPrecision(2)));
  return x.toExponential(1);
}

/** Scientific notation with two significant digits, as errors are shown (3.1e-15). */
export function formatScientific(x: number): string {
  if (!Number.isFinite(x)) return formatValue(x);
  return x === 0 ? '0' : x.toExponential(1);
}

/** A speed ratio with two decimals and the multiplication sign (0.84×). */
export function formatSpeedRatio(x: number): string {
  return `${x.toFixed(2)}×`;
}
