/** The three signals of design.md, plus a neutral one for "not judged". */
export type Signal = 'within' | 'near' | 'beyond' | 'neutral';

export const signalSymbol: Record<Signal, string> = {
  within: '✓',
  near: '~',
  beyond: '✕',
  neutral: '·',
};

export const signalClasses: Record<Signal, string> = {
  within: 'border-within/50 bg-within/10 text-within',
  near: 'border-near/50 bg-near/10 text-near',
  beyond: 'border-beyond/50 bg-beyond/10 text-beyond',
  neutral: 'border-rule bg-paper-deep text-ink-soft',
};
