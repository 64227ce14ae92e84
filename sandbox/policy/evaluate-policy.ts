import { formatValue } from '@shared/number-format.ts';
import type { AcceptancePolicy, RuleResult } from '@shared/acceptance-policy.ts';
import type { MatrixReport, TimingReport } from '@shared/trial-report.ts';
import { accuracyLosses } from './accuracy-comparison.ts';

const fmt = formatValue;
const list = (ids: string[]) =>
  ids.length > 4 ? `${ids.slice(0, 4).join(', ')} and ${ids.length - 4} more` : ids.join(', ');

/** Rule 1: every matrix that must factor was factored within the accuracy threshold. */
function factorAccuracyRule(matrices: MatrixReport[], policy: AcceptancePolicy): RuleResult {
  const mustFactor = matrices.filter((m) => m.expected === 'factor');
  const offenders = mustFactor.filter((m) => !m.passed).map((m) => m.id);
  const passed = offenders.length === 0;
  return {
    rule: 'factor-accuracy',
    passed,
    offenders,
    reason: passed
      ? `All ${mustFactor.length} matrices that must factor were factored with a factor ratio at most ${policy.maxFactorRatio}.`
      : `${offenders.length} of ${mustFactor.length} matrices that must factor failed: ${list(offenders)}.`,
  };
}

/** Rule 2: every matrix that must be rejected made the kernel throw. */
function rejectionRule(matrices: MatrixReport[], policy: AcceptancePolicy): RuleResult {
  const mustReject = matrices.filter((m) => m.expected === 'reject');
  const offenders = mustReject.filter((m) => m.candidate.status !== 'threw').map((m) => m.id);
  const passed = !policy.requireRejections || offenders.length === 0;
  let reason: string;
  if (mustReject.length === 0)
    reason = 'The matrix set holds no matrix that must be rejected for this routine.';
  else if (offenders.length === 0)
    reason = `All ${mustReject.length} matrices that must be rejected were rejected.`;
  else
    reason = `${offenders.length} of ${mustReject.length} matrices that must be rejected were not: ${list(offenders)}${
      policy.requireRejections ? '' : ' (the policy does not require rejections)'
    }.`;
  return { rule: 'rejections', passed, offenders, reason };
}

/** Rule 3: no accuracy metric worse than the incumbent's by more than the policy's factor. */
function versusIncumbentRule(matrices: MatrixReport[], policy: AcceptancePolicy): RuleResult {
  if (!matrices.some((m) => m.incumbent)) {
    return {
      rule: 'versus-incumbent',
      passed: true,
      offenders: [],
      reason: 'No incumbent to compare with.',
    };
  }
  const offenders: string[] = [];
  let worst: { id: string; metric: string; factor: number } | null = null;
  for (const m of matrices) {
    const losses = accuracyLosses(m, policy.maxAccuracyLossFactor);
    if (losses.length === 0) continue;
    offenders.push(m.id);
    for (const l of losses)
      if (!worst || l.factor > worst.factor)
        worst = { id: m.id, metric: l.metric, factor: l.factor };
  }
  const passed = offenders.length === 0;
  return {
    rule: 'versus-incumbent',
    passed,
    offenders,
    reason: passed
      ? `No accuracy metric is worse than the incumbent's by more than ${policy.maxAccuracyLossFactor}× on any matrix.`
      : `Accuracy is worse than the incumbent's by more than ${policy.maxAccuracyLossFactor}× on ${offenders.length} matrices (${list(
          offenders,
        )}); the largest loss is ${fmt(worst!.factor)}× in ${worst!.metric} on ${worst!.id}.`,
  };
}

/** Rule 4: no size is slower than the incumbent beyond the allowed slowdown. */
function timingRule(timing: TimingReport[], policy: AcceptancePolicy): RuleResult {
  const compared = timing.filter((t) => t.ratio !== null);
  if (compared.length === 0) {
    const failed = timing.filter((t) => t.message);
    return {
      rule: 'timing',
      passed: failed.length === 0,
      offenders: failed.map((t) => `n=${t.n}`),
      reason:
        failed.length === 0
          ? 'No incumbent timing to compare with.'
          : `Timing could not run at ${failed.map((t) => `n = ${t.n}`).join(', ')}: ${failed[0]!.message}.`,
    };
  }
  const slow = compared.filter(
    (t) => t.verdict === 'slower' && t.ratio! > 1 + policy.allowedSlowdown,
  );
  const broken = timing.filter((t) => t.message && t.ratio === null);
  const offenders = [...slow, ...broken].map((t) => `n=${t.n}`);
  const passed = offenders.length === 0;
  const pct = Math.round(policy.allowedSlowdown * 100);
  return {
    rule: 'timing',
    passed,
    offenders,
    reason: passed
      ? `No size is slower than the incumbent by more than ${pct} % (${compared.length} sizes compared).`
      : [
          ...slow.map(
            (t) =>
              `n = ${t.n} is slower: ${fmt(t.ratio!)}× (95 % interval ${fmt(t.ci95![0])}–${fmt(t.ci95![1])}×)`,
          ),
          ...broken.map((t) => `n = ${t.n} could not be timed: ${t.message}`),
        ].join('; ') + ` (allowed slowdown ${pct} %).`,
  };
}

/** Applies a routine's acceptance policy to a trial's per-matrix and timing results. */
export function evaluatePolicy(
  matrices: MatrixReport[],
  timing: TimingReport[],
  policy: AcceptancePolicy,
): { passed: boolean; rules: RuleResult[] } {
  const rules = [
    factorAccuracyRule(matrices, policy),
    rejectionRule(matrices, policy),
    versusIncumbentRule(matrices, policy),
    timingRule(timing, policy),
  ];
  return { passed: rules.every((r) => r.passed), rules };
}
