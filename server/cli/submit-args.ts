import { parseArgs } from 'node:util';
import { slugSchema } from '@shared/api/params.ts';

export interface SubmitOptions {
  kernelPath: string;
  teamSlug: string;
  routineSlug: string;
  /** The candidate's title; the kernel file's name when not given. */
  title: string | undefined;
  description: string | undefined;
  /** Base URL of the Stablehand server, without a trailing slash. */
  serverUrl: string;
  /** Submit a new revision of this candidate instead of a new candidate. */
  candidateId: number | undefined;
  token: string;
}

export const defaultServerUrl = 'http://127.0.0.1:3000';

export const submitUsage = `Usage: npm run submit -- <kernel.ts> --routine <team-slug>/<routine-slug>
                     [--title <text>] [--description <text>] [--server <url>]
                     [--candidate <id>]

  --routine      the routine, as the team's slug and the routine's slug
  --title        the new candidate's title (default: the kernel file's name)
  --description  the new candidate's description
  --candidate    submit the kernel as a new revision of this candidate (yours)
  --server       the Stablehand server (default: STABLEHAND_URL, else ${defaultServerUrl})

The API token is read from STABLEHAND_TOKEN (create one on your account page).

Exit code: 0 when the trial passes the routine's acceptance policy, 1 when it fails, is
rejected by the type check or cannot run, or the server refuses the request, 2 on a usage error.`;

export class UsageError extends Error {}

/**
 * Parses the submit command's arguments and environment; throws UsageError with a message for
 * the user (an empty message asks for the usage text alone).
 */
export function parseSubmitArgs(argv: string[], env: NodeJS.ProcessEnv): SubmitOptions {
  let parsed;
  try {
    parsed = parseArgs({
      args: argv,
      allowPositionals: true,
      strict: true,
      options: {
        routine: { type: 'string' },
        title: { type: 'string' },
        description: { type: 'string' },
        server: { type: 'string' },
        candidate: { type: 'string' },
        help: { type: 'boolean', short: 'h', default: false },
      },
    });
  } catch (err) {
    throw new UsageError((err as Error).message);
  }
  const { values, positionals } = parsed;
  if (values.help) throw new UsageError('');
  if (positionals.length !== 1) throw new UsageError('Give exactly one kernel file.');
  if (!values.routine) throw new UsageError('--routine <team-slug>/<routine-slug> is required.');
  const [teamSlug, routineSlug, ...rest] = values.routine.split('/');
  if (
    rest.length > 0 ||
    !slugSchema.safeParse(teamSlug).success ||
    !slugSchema.safeParse(routineSlug).success
  ) {
    throw new UsageError(
      `--routine must be <team-slug>/<routine-slug>, for example frame-analysis/dense-lu; got "${values.routine}".`,
    );
  }
  const candidateId = values.candidate === undefined ? undefined : Number(values.candidate);
  if (
    candidateId !== undefined &&
    !(Number.isInteger(candidateId) && candidateId > 0 && candidateId <= 2_147_483_647)
  ) {
    throw new UsageError(`--candidate must be a candidate's id (a positive whole number).`);
  }
  if (
    candidateId !== undefined &&
    (values.title !== undefined || values.description !== undefined)
  ) {
    throw new UsageError(
      '--title and --description describe a new candidate; a revision has neither.',
    );
  }
  if (values.title !== undefined && values.title.trim() === '') {
    throw new UsageError('--title must not be empty.');
  }
  const serverText = values.server ?? env.STABLEHAND_URL ?? defaultServerUrl;
  let serverUrl: URL;
  try {
    serverUrl = new URL(serverText);
  } catch {
    throw new UsageError(
      `--server must be a URL such as ${defaultServerUrl}; got "${serverText}".`,
    );
  }
  if (serverUrl.protocol !== 'http:' && serverUrl.protocol !== 'https:') {
    throw new UsageError(`--server must be an http or https URL; got "${serverText}".`);
  }
  const token = env.STABLEHAND_TOKEN?.trim() ?? '';
  if (token === '') {
    throw new UsageError('Set STABLEHAND_TOKEN to an API token of yours.');
  }
  return {
    kernelPath: positionals[0]!,
    teamSlug: teamSlug!,
    routineSlug: routineSlug!,
    title: values.title?.trim(),
    description: values.description,
    serverUrl: serverUrl.toString().replace(/\/+$/, ''),
    candidateId,
    token,
  };
}
