import type { AcceptancePolicy } from '@shared/acceptance-policy.ts';

const percent = (x: number) => `${Number((x * 100).toPrecision(3))} %`;

/** The acceptance policy as the sentences a reviewer checks a trial against. */
export function PolicyList({ policy }: { policy: AcceptancePolicy }) {
  const rules: [string, string][] = [
    [
      'Accuracy',
      `Every matrix that must factor has a factor ratio of at most ${policy.maxFactorRatio} (the threshold grows with the matrix’s reference growth factor).`,
    ],
    [
      'Rejections',
      policy.requireRejections
        ? 'Every matrix that must be rejected makes the kernel throw.'
        : 'Rejections are not required.',
    ],
    [
      'Against the incumbent',
      `No accuracy metric may be worse than the incumbent’s by more than ${policy.maxAccuracyLossFactor}× on any matrix.`,
    ],
    [
      'Timing',
      `A size judged slower fails when it is more than ${percent(policy.allowedSlowdown)} slower; differences under ${percent(policy.timingMargin)} are never called faster or slower.`,
    ],
    [
      'Sign-offs',
      `${policy.signOffsRequired} reviewer sign-off${policy.signOffsRequired === 1 ? '' : 's'} before a candidate is cleared.`,
    ],
  ];
  return (
    <dl className="grid grid-cols-[10rem_1fr] gap-x-4 gap-y-2 text-sm">
      {rules.map(([term, text]) => (
        <div key={term} className="contents">
          <dt className="font-medium">{term}</dt>
          <dd className="text-ink-soft">{text}</dd>
        </div>
      ))}
    </dl>
  );
}
