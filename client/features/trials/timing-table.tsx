import {
  formatGflops,
  formatInterval,
  formatMs,
  formatTimingRatio,
} from '@client/components/number-format.ts';
import { SignalBadge } from '@client/components/signal-badge.tsx';
import type { Signal } from '@client/components/signal.ts';
import type { TimingReport } from '@shared/trial-report.ts';

const verdictSignal: Record<string, Signal> = {
  faster: 'within',
  slower: 'beyond',
  'no clear difference': 'near',
};

/** The engine's timing flags (sandbox/timing/interleaved.ts) in words; an unknown one as it is. */
const timingFlagWords: Record<string, string> = {
  'candidate-stuck-slow': 'candidate stuck slow: most blocks ran well above its warm time',
  'incumbent-stuck-slow': 'incumbent stuck slow: most blocks ran well above its warm time',
  'candidate-failed': 'candidate failed while timed',
  'incumbent-failed': 'incumbent failed while timed',
};

/** Per timing size: medians, GFLOP/s, the ratio with its 95 % interval, and the verdict. */
export function TimingTable({ timing }: { timing: readonly TimingReport[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-sm" data-testid="timing-table">
        <caption className="sr-only">Timing per size, candidate against incumbent</caption>
        <thead className="border-b border-ink/30 text-ink-soft">
          <tr>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              n
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Rounds
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Candidate median
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Incumbent median
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Candidate speed
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Incumbent speed
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              Time ratio
            </th>
            <th scope="col" className="px-2 py-2 text-right font-medium">
              95 % interval
            </th>
            <th scope="col" className="px-2 py-2 text-left font-medium">
              Verdict
            </th>
          </tr>
        </thead>
        <tbody className="font-mono text-xs">
          {timing.map((t) => (
            <tr key={t.n} className="border-b border-rule">
              <td className="px-2 py-2 text-right">{t.n}</td>
              <td className="px-2 py-2 text-right">
                {t.rounds}
                {t.blocks ? (
                  <span
                    className="block text-ink-soft"
                    title="each block times both kernels in fresh isolates"
                  >
                    in {t.blocks} blocks
                  </span>
                ) : null}
              </td>
              <td className="px-2 py-2 text-right">
                {formatMs(t.candidateDetail?.medianMs ?? t.candidate)}
              </td>
              <td className="px-2 py-2 text-right">
                {formatMs(t.incumbentDetail?.medianMs ?? t.incumbent)}
              </td>
              <td className="px-2 py-2 text-right">{formatGflops(t.candidateDetail?.gflops)}</td>
              <td className="px-2 py-2 text-right">{formatGflops(t.incumbentDetail?.gflops)}</td>
              <td className="px-2 py-2 text-right">{formatTimingRatio(t.ratio)}</td>
              <td className="px-2 py-2 text-right">
                {formatInterval(t.ci95)}
                {t.betweenBlockSpread != null ? (
                  <span
                    className="block text-ink-soft"
                    title="the interval is taken across the blocks' ratios; this is their spread"
                  >
                    blocks ±{(t.betweenBlockSpread * 100).toFixed(1)} %
                  </span>
                ) : null}
              </td>
              <td className="px-2 py-2 font-sans">
                {t.verdict ? (
                  <SignalBadge signal={verdictSignal[t.verdict] ?? 'neutral'}>
                    {t.verdict}
                  </SignalBadge>
                ) : (
                  <span className="text-ink-soft">{t.message ?? 'not judged'}</span>
                )}
                {t.flags.length > 0 ? (
                  <span className="mt-1 block text-xs text-ink-soft">
                    {t.flags.map((f) => timingFlagWords[f] ?? f).join('; ')}
                  </span>
                ) : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
