import { formatGiB, formatMs } from '@client/components/number-format.ts';
import type { Machine, PhaseTimes } from '@shared/trial-report.ts';

/** The machine the trial ran on, and how long each phase took. */
export function MachineCard({
  machine,
  phases,
}: {
  machine: Machine | null;
  phases: PhaseTimes | null;
}) {
  if (!machine)
    return <p className="text-sm text-ink-soft">Not recorded (the trial did not run).</p>;
  const rows: [string, string][] = [
    ['Processor', machine.cpuModel],
    ['Cores', String(machine.cores)],
    ['Memory', formatGiB(machine.totalMemoryBytes)],
    ['Platform', machine.platform],
    ['Node', machine.nodeVersion],
    ['V8', machine.v8Version],
    ['isolated-vm', machine.isolatedVmVersion],
  ];
  if (phases) {
    rows.push(
      ['Compile', formatMs(phases.compileMs)],
      ['Accuracy runs', formatMs(phases.kernelMs)],
      ['Timing', formatMs(phases.timingMs)],
      ['Total', formatMs(phases.totalMs)],
    );
  }
  return (
    <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm" data-testid="machine">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="text-ink-soft">{k}</dt>
          <dd className="font-mono text-xs leading-5">{v}</dd>
        </div>
      ))}
    </dl>
  );
}
