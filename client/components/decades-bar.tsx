import { formatRatio } from './number-format.ts';

export interface DecadesMark {
  value: number | null | undefined;
  /** The candidate is drawn as a filled dot, the incumbent as a ring. */
  who: 'candidate' | 'incumbent';
}

const width = 150;
const height = 20;
const pad = 6;

/**
 * A small log-scale bar, one tick per decade, so 1e-16 and 1e-8 read as far apart as they are
 * (design.md). Marks beyond the ends sit on the end with an arrow; a bound is drawn as a
 * vermilion rule. The numbers themselves are in the accessible label.
 */
export function DecadesBar({
  marks,
  bound,
  decades = [-3, 3],
  label,
}: {
  marks: readonly DecadesMark[];
  bound?: number | null;
  /** Exponents of the ends: [-3, 3] spans 1e-3 to 1e3. */
  decades?: readonly [number, number];
  label: string;
}) {
  const [lo, hi] = decades;
  const x = (v: number) => {
    const e = Math.log10(v);
    const t = (Math.min(Math.max(e, lo), hi) - lo) / (hi - lo);
    return pad + t * (width - 2 * pad);
  };
  const ticks: number[] = [];
  for (let e = Math.ceil(lo); e <= hi; e++) ticks.push(e);
  const words = marks
    .map((m) => `${m.who} ${formatRatio(m.value)}`)
    .concat(bound ? [`bound ${formatRatio(bound)}`] : [])
    .join(', ');
  return (
    <svg
      role="img"
      aria-label={`${label}: ${words}`}
      width={width}
      height={height}
      viewBox={`0 0 ${width} ${height}`}
      className="inline-block align-middle"
    >
      <line x1={pad} x2={width - pad} y1={10} y2={10} stroke="var(--color-rule)" strokeWidth={2} />
      {ticks.map((e) => (
        <line
          key={e}
          x1={x(10 ** e)}
          x2={x(10 ** e)}
          y1={e === 0 ? 4 : 7}
          y2={e === 0 ? 16 : 13}
          stroke="var(--color-ink-soft)"
          strokeOpacity={e === 0 ? 0.8 : 0.4}
        />
      ))}
      {bound && bound > 0 ? (
        <line
          x1={x(bound)}
          x2={x(bound)}
          y1={2}
          y2={18}
          stroke="var(--color-beyond)"
          strokeWidth={1.5}
        />
      ) : null}
      {marks.map((m, i) => {
        if (m.value === null || m.value === undefined) return null;
        const v = Number.isNaN(m.value) ? NaN : m.value <= 0 ? 10 ** lo : m.value;
        if (Number.isNaN(v)) return null;
        const cx = x(v);
        const off = Math.log10(v) > hi || Math.log10(v) < lo;
        const candidate = m.who === 'candidate';
        return off ? (
          <path
            key={i}
            d={
              Math.log10(v) > hi
                ? `M${cx - 5},${5} L${cx + 1},10 L${cx - 5},15 Z`
                : `M${cx + 5},${5} L${cx - 1},10 L${cx + 5},15 Z`
            }
            fill={candidate ? 'var(--color-ink)' : 'none'}
            stroke="var(--color-ink)"
          />
        ) : (
          <circle
            key={i}
            cx={cx}
            cy={10}
            r={candidate ? 3.5 : 4.5}
            fill={candidate ? 'var(--color-ink)' : 'none'}
            stroke="var(--color-ink)"
            strokeWidth={candidate ? 0 : 1.5}
          />
        );
      })}
    </svg>
  );
}
