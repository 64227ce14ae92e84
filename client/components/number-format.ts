import { formatScientific, formatSpeedRatio, formatValue } from '@shared/number-format.ts';

/** Number formats of the pages (design.md): errors 3.1e-15, ratios 0.84×, speeds in GFLOP/s. */
export { formatScientific, formatSpeedRatio, formatValue };

const dash = '—';

/** An error or a condition number in scientific notation with 2 significant digits; — when absent. */
export function formatError(x: number | null | undefined): string {
  return x === null || x === undefined ? dash : formatScientific(x);
}

/** A ratio to a bound or to the incumbent: 2 significant digits, scientific when tiny or huge. */
export function formatRatio(x: number | null | undefined): string {
  return x === null || x === undefined ? dash : formatValue(x);
}

/** A speed ratio with its sign (0.84×); — when absent. */
export function formatTimingRatio(x: number | null | undefined): string {
  return x === null || x === undefined || !Number.isFinite(x) ? dash : formatSpeedRatio(x);
}

/** A 95 % interval of a speed ratio: [0.81×, 0.88×]. */
export function formatInterval(ci: readonly [number, number] | null | undefined): string {
  return ci ? `[${formatSpeedRatio(ci[0])}, ${formatSpeedRatio(ci[1])}]` : dash;
}

/** GFLOP/s with 3 significant digits. */
export function formatGflops(x: number | null | undefined): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return dash;
  return `${Number(x.toPrecision(3))} GFLOP/s`;
}

/** A duration in milliseconds: 3 significant digits below a second, else seconds. */
export function formatMs(ms: number | null | undefined): string {
  if (ms === null || ms === undefined || !Number.isFinite(ms)) return dash;
  if (ms >= 1000) return `${Number((ms / 1000).toPrecision(3))} s`;
  return `${Number(ms.toPrecision(3))} ms`;
}

/** Bytes as GiB with one decimal. */
export function formatGiB(bytes: number): string {
  return `${(bytes / 2 ** 30).toFixed(1)} GiB`;
}

const dateTime = new Intl.DateTimeFormat('en-GB', {
  dateStyle: 'medium',
  timeStyle: 'short',
  timeZone: 'UTC',
});

/** An ISO time as "2 Dec 2026, 13:05 UTC". */
export function formatDateTime(iso: string | null | undefined): string {
  return iso ? `${dateTime.format(new Date(iso))} UTC` : dash;
}
