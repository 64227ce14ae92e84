/** The three signals of design.md, plus a neutral one for "not judged". */
export type Signal = 'within' | 'near' | 'beyond' | 'neutral';

export const signalSymbol: Record<Signal, string> = {
  within: '✓',
  near: '~',
  beyond: '✕',
  neutral: '·',
};

// The words are drawn in a darker shade of each signal so they keep a 4.5:1 contrast on its tint.
export const signalClasses: Record<Signal, string> = {
  within: 'border-within/50 bg-within/10 text-[color-mix(in_srgb,var(--color-within)_72%,black)]',
  near: 'border-near/50 bg-near/10 text-[color-mix(in_srgb,var(--color-near)_62%,black)]',
  beyond: 'border-beyond/50 bg-beyond/10 text-[color-mix(in_srgb,var(--color-beyond)_78%,black)]',
  neutral: 'border-rule bg-paper-deep text-ink-soft',
};
