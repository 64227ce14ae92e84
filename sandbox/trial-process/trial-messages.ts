import type { TrialReport } from '@shared/trial-report.ts';
import type { TrialInput, TrialProgress } from '../trial.ts';

/**
 * What the parent sends the trial process over IPC: the TrialInput whole, minus its callback.
 * The channel uses Node's 'advanced' serialisation (the structured clone algorithm), so the
 * matrices' Float64Arrays, NaN and ±Infinity arrive as they were sent.
 */
export type TrialInputData = Omit<TrialInput, 'onProgress'>;

export type ParentMessage = { kind: 'run'; input: TrialInputData };

/**
 * What the trial process sends back: ready once it has loaded, then for each trial started,
 * progress…, and a report or an error.
 */
export type ChildMessage =
  | { kind: 'ready' }
  | { kind: 'started' }
  | { kind: 'progress'; progress: TrialProgress }
  | { kind: 'report'; report: TrialReport }
  /** runTrial threw: a fault of the harness, not of a kernel (runTrial never throws for those). */
  | { kind: 'error'; message: string; stack?: string };

const childKinds = new Set<string>(['ready', 'started', 'progress', 'report', 'error']);

export function isChildMessage(value: unknown): value is ChildMessage {
  return (
    typeof value === 'object' &&
    value !== null &&
    childKinds.has(String((value as { kind?: unknown }).kind))
  );
}

export function isParentMessage(value: unknown): value is ParentMessage {
  return (
    typeof value === 'object' &&
    value !== null &&
    (value as { kind?: unknown }).kind === 'run' &&
    typeof (value as { input?: unknown }).input === 'object'
  );
}
