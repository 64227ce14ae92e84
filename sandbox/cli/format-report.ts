import type { MatrixReport, TimingReport, TrialReport } from '@shared/trial-report.ts';

const sci = (x: number | undefined) =>
  x === undefined ? '—' : !Number.isFinite(x) ? String(x) : x === 0 ? '0' : x.toExponential(1);
const ratio = (x: number | null) => (x === null ? '—' : `${x.toFixed(2)}×`);

function table(headers: string[], rows: string[][]): string {
  const widths = headers.map((h, c) => Math.max(h.length, ...rows.map((r) => (r[c] ?? '').length)));
  const line = (cells: string[]) =>
    cells
      .map((cell, c) => cell.padEnd(widths[c]!))
      .join('  ')
      .trimEnd();
  return [line(headers), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n');
}

function headlineMetric(report: TrialReport): 'factorRatio' | 'solveResidualRatio' {
  return report.routine === 'back-substitution' ? 'solveResidualRatio' : 'factorRatio';
}

function matrixRow(m: MatrixReport, metric: 'factorRatio' | 'solveResidualRatio'): string[] {
  const cand = m.candidate.status === 'ok' ? sci(m.candidate.metrics[metric]) : m.candidate.status;
  const inc = !m.incumbent
    ? '—'
    : m.incumbent.status === 'ok'
      ? sci(m.incumbent.metrics[metric])
      : m.incumbent.status;
  return [
    m.id,
    `${m.m === m.n ? m.n : `${m.m}×${m.n}`}`,
    m.condition === null ? '—' : `${sci(m.condition)}${m.conditionKind === 'exact' ? '' : '~'}`,
    m.expected,
    cand,
    inc,
    sci(m.candidate.metrics.forwardError),
    m.passed ? 'pass' : 'FAIL',
  ];
}

function timingRow(t: TimingReport): string[] {
  return [
    String(t.n),
    String(t.rounds),
    t.candidate === null ? '—' : t.candidate.toFixed(3),
    t.incumbent === null ? '—' : t.incumbent.toFixed(3),
    t.candidateDetail ? t.candidateDetail.gflops.toFixed(2) : '—',
    ratio(t.ratio),
    t.ci95 ? `${t.ci95[0].toFixed(2)}–${t.ci95[1].toFixed(2)}` : '—',
    t.verdict ?? t.message ?? '—',
  ];
}

/** The evaluator's readable report: matrices, timing, failures and the verdict rule by rule. */
export function formatReport(report: TrialReport): string {
  const out: string[] = [];
  out.push(
    `${report.routine} on set "${report.set}" — ${report.machine.cpuModel}, ${report.machine.cores} cores, Node ${report.machine.nodeVersion}`,
  );
  if (report.status === 'trial-failed') {
    out.push('', `The trial could not run: ${report.message ?? 'unknown reason'}`);
    for (const d of report.diagnostics.candidate)
      out.push(`  ${d.file}:${d.line}:${d.column} ${d.code} ${d.message}`);
  }
  if (report.matrices.length > 0) {
    const metric = headlineMetric(report);
    const label = metric === 'factorRatio' ? 'factor ratio' : 'solve ratio';
    out.push(
      '',
      table(
        [
          'matrix',
          'n',
          'κ₁',
          'expected',
          `candidate ${label}`,
          `incumbent ${label}`,
          'forward error',
          'result',
        ],
        report.matrices.map((m) => matrixRow(m, metric)),
      ),
    );
    const failed = report.matrices.filter((m) => !m.passed);
    if (failed.length > 0) {
      out.push('', 'Failures:');
      for (const m of failed) out.push(`  ${m.id}: ${m.failures.join('; ')}`);
    }
  }
  if (report.timing.length > 0) {
    out.push(
      '',
      table(
        [
          'n',
          'rounds',
          'candidate ms',
          'incumbent ms',
          'GFLOP/s',
          'ratio',
          '95 % interval',
          'verdict',
        ],
        report.timing.map(timingRow),
      ),
    );
  }
  out.push('', `Verdict: ${report.verdict.passed ? 'PASSED' : 'FAILED'}`);
  for (const r of report.verdict.rules)
    out.push(`  ${r.passed ? '✓' : '✗'} ${r.rule}: ${r.reason}`);
  const p = report.phases;
  out.push(
    '',
    `Time: ${(p.totalMs / 1000).toFixed(1)} s (compile ${p.compileMs.toFixed(0)} ms, matrices ${p.matricesMs.toFixed(0)} ms, ` +
      `kernel calls ${p.kernelMs.toFixed(0)} ms, reference ${p.referenceMs.toFixed(0)} ms, metrics ${p.metricsMs.toFixed(0)} ms, ` +
      `timing ${p.timingMs.toFixed(0)} ms)`,
  );
  return out.join('\n');
}
