import { parseArgs } from 'node:util';
import { routineSlugs, type RoutineSlug } from '@shared/routines.ts';

export interface EvaluateOptions {
  kernelPath: string;
  routine: RoutineSlug;
  againstPath: string | null;
  set: string;
  json: boolean;
  timing: boolean;
  callTimeoutMs: number | undefined;
}

export const usage = `Usage: npm run evaluate -- <kernel.ts> --routine <slug> [--against <incumbent.ts>]
                       [--set quick|standard|<set.json>] [--json] [--no-timing]

  --routine   one of: ${routineSlugs.join(', ')}
  --against   the incumbent kernel to compare with (accuracy side by side, interleaved timing)
  --set       the matrix set: quick (default), standard, or a JSON file listing matrices
  --json      print one JSON document on stdout instead of tables
  --no-timing skip the timing rounds
  --call-timeout <ms>  time limit of one kernel call (default 10000)

Exit code: 0 when the acceptance policy passes, 1 when it fails, 2 on a usage or input error.`;

export class UsageError extends Error {}

/** Parses the evaluator's command line; throws UsageError with a message for the user. */
export function parseEvaluateArgs(argv: string[]): EvaluateOptions {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      options: {
        routine: { type: 'string' },
        against: { type: 'string' },
        set: { type: 'string', default: 'quick' },
        json: { type: 'boolean', default: false },
        'no-timing': { type: 'boolean', default: false },
        'call-timeout': { type: 'string' },
        help: { type: 'boolean', short: 'h', default: false },
      },
    });
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) throw new UsageError('');
  if (positionals.length !== 1) throw new UsageError('Give exactly one kernel file.');
  const routine = values.routine;
  if (!routine) throw new UsageError('--routine is required.');
  if (!(routineSlugs as readonly string[]).includes(routine)) {
    throw new UsageError(
      `Unknown routine "${routine}"; expected one of ${routineSlugs.join(', ')}.`,
    );
  }
  const timeoutText = values['call-timeout'];
  const callTimeoutMs = timeoutText === undefined ? undefined : Number(timeoutText);
  if (
    callTimeoutMs !== undefined &&
    !(Number.isInteger(callTimeoutMs) && callTimeoutMs >= 10 && callTimeoutMs <= 600_000)
  ) {
    throw new UsageError(
      '--call-timeout must be a whole number of milliseconds from 10 to 600000.',
    );
  }
  return {
    callTimeoutMs,
    kernelPath: positionals[0]!,
    routine: routine as RoutineSlug,
    againstPath: values.against ?? null,
    set: values.set ?? 'quick',
    json: values.json ?? false,
    timing: !values['no-timing'],
  };
}
