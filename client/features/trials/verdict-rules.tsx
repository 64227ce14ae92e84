import { SignalBadge } from '@client/components/signal-badge.tsx';
import type { PolicyRuleId, RuleResult } from '@shared/acceptance-policy.ts';

const ruleTitles: Record<PolicyRuleId, string> = {
  'factor-accuracy': 'Accuracy of the factors',
  rejections: 'Matrices it must reject',
  'versus-incumbent': 'Accuracy against the incumbent',
  timing: 'Timing against the incumbent',
};

/** The policy verdict rule by rule, in the plain words the evaluator wrote. */
export function VerdictRules({ rules }: { rules: readonly RuleResult[] }) {
  return (
    <ol className="divide-y divide-rule rounded border border-rule" data-testid="verdict-rules">
      {rules.map((r) => (
        <li key={r.rule} className="grid grid-cols-[7rem_1fr] gap-3 px-4 py-3">
          <span>
            <SignalBadge signal={r.passed ? 'within' : 'beyond'}>
              {r.passed ? 'met' : 'not met'}
            </SignalBadge>
          </span>
          <span>
            <span className="font-medium">{ruleTitles[r.rule]}.</span>{' '}
            <span className="text-ink-soft">{r.reason}</span>
            {r.offenders.length > 0 ? (
              <span className="mt-1 block font-mono text-xs text-beyond">
                {r.offenders.slice(0, 12).join(', ')}
                {r.offenders.length > 12 ? ` and ${r.offenders.length - 12} more` : ''}
              </span>
            ) : null}
          </span>
        </li>
      ))}
    </ol>
  );
}
