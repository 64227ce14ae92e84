import { readFileSync } from 'node:fs';
import path from 'node:path';
import { maxKernelSourceBytes } from '@shared/api/revisions.ts';
import type { Submission } from '@shared/api/candidates.ts';
import { followTrial } from './follow-trial.ts';
import { parseSubmitArgs, submitUsage, UsageError, type SubmitOptions } from './submit-args.ts';
import {
  ApiRequestError,
  createSubmitApiClient,
  ServerUnreachableError,
  type SubmitApiClient,
} from './submit-api-client.ts';
import { formatDiagnostics, formatLinks, formatProgress, formatVerdict } from './submit-report.ts';

// `npm run submit -- <kernel.ts> --routine <team>/<routine>`: submits a kernel to a Stablehand
// server with an API token, follows its trial and exits 0 on a pass, 1 otherwise, 2 on a usage
// error. Output goes to stdout; errors to stderr.

/** The submission cannot go ahead: no such team or routine, or a candidate of another routine. */
class CannotSubmit extends Error {}

const say = (line: string) => process.stdout.write(`${line}\n`);
const complain = (line: string) => process.stderr.write(`error: ${line}\n`);

function readKernel(file: string): string {
  let source: string;
  try {
    source = readFileSync(file, 'utf8');
  } catch (err) {
    const code = (err as NodeJS.ErrnoException).code ?? (err as Error).message;
    throw new Error(`Cannot read the kernel file ${file} (${code}).`, { cause: err });
  }
  if (Buffer.byteLength(source) > maxKernelSourceBytes) {
    throw new UsageError(`${file} is larger than ${maxKernelSourceBytes} bytes.`);
  }
  return source;
}

/** The routine's id, found by the team's slug and its own among the caller's teams. */
async function findRoutineId(client: SubmitApiClient, options: SubmitOptions): Promise<number> {
  const team = (await client.teams()).find((t) => t.slug === options.teamSlug);
  if (!team) {
    throw new CannotSubmit(
      `No team "${options.teamSlug}" among your teams on ${client.serverUrl} (check the slug and your membership).`,
    );
  }
  const routine = (await client.routines(team.id)).find((r) => r.slug === options.routineSlug);
  if (!routine) {
    throw new CannotSubmit(`Team "${team.slug}" has no routine "${options.routineSlug}".`);
  }
  return routine.id;
}

async function submit(options: SubmitOptions, source: string): Promise<number> {
  const client = createSubmitApiClient(options.serverUrl, options.token);
  let submission: Submission;
  const routineId = await findRoutineId(client, options);
  if (options.candidateId !== undefined) {
    const candidate = await client.candidate(options.candidateId);
    if (candidate.routine.id !== routineId) {
      throw new CannotSubmit(
        `Candidate ${candidate.id} belongs to the routine "${candidate.routine.title}", not to ${options.teamSlug}/${options.routineSlug}.`,
      );
    }
    submission = await client.submitRevision(options.candidateId, { source });
  } else {
    submission = await client.submitCandidate(routineId, {
      title: options.title ?? path.basename(options.kernelPath),
      ...(options.description !== undefined ? { description: options.description } : {}),
      source,
    });
  }
  const { candidate, revision, trial } = submission;
  say(`candidate ${candidate.id} "${candidate.title}", revision ${revision.number}`);
  for (const line of formatDiagnostics(options.kernelPath, submission)) say(line);
  if (trial === null) {
    say('rejected: the kernel does not meet its contract, so no trial runs.');
    for (const line of formatLinks(options.serverUrl, options.teamSlug, submission, null))
      say(line);
    return 1;
  }
  say(`trial ${trial.id} queued`);
  let last = '';
  const finished = await followTrial(client, trial.id, {
    onProgress: (event) => {
      const line = formatProgress(event);
      if (line !== last) say(line);
      last = line;
    },
  });
  for (const line of formatVerdict(finished)) say(line);
  for (const line of formatLinks(options.serverUrl, options.teamSlug, submission, trial.id))
    say(line);
  return finished.status === 'completed' && finished.passed === true ? 0 : 1;
}

async function main(argv: string[]): Promise<number> {
  let options: SubmitOptions;
  let source: string;
  try {
    options = parseSubmitArgs(argv, process.env);
    source = readKernel(options.kernelPath);
  } catch (err) {
    if (err instanceof UsageError) {
      if (err.message) complain(err.message);
      process.stderr.write(`${err.message ? '\n' : ''}${submitUsage}\n`);
      return 2;
    }
    complain((err as Error).message);
    return 2;
  }
  try {
    return await submit(options, source);
  } catch (err) {
    if (err instanceof CannotSubmit || err instanceof ServerUnreachableError) {
      complain(err.message);
    } else if (err instanceof ApiRequestError) {
      const hint =
        err.status === 401
          ? ' Check STABLEHAND_TOKEN: the token may be mistyped or revoked.'
          : err.status === 404
            ? ' It does not exist, or you are not a member of its team.'
            : '';
      complain(`the server refused: ${err.message} (${err.status} ${err.code}).${hint}`);
      if (err.details !== undefined) process.stderr.write(`${JSON.stringify(err.details)}\n`);
    } else {
      throw err;
    }
    return 1;
  }
}

main(process.argv.slice(2)).then(
  (code) => {
    process.exitCode = code;
  },
  (err: unknown) => {
    complain((err as Error).stack ?? String(err));
    process.exitCode = 1;
  },
);
