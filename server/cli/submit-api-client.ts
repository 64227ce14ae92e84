import type { z } from 'zod';
import {
  candidateDetailSchema,
  submissionSchema,
  type CandidateDetail,
  type Submission,
} from '@shared/api/candidates.ts';
import { routinePageSchema, type RoutineSummary } from '@shared/api/routines.ts';
import { teamPageSchema, type TeamSummary } from '@shared/api/teams.ts';
import { trialDetailSchema, type TrialDetail } from '@shared/api/trials.ts';
import { apiErrorSchema, type ErrorCode } from '@shared/errors.ts';
import { parseWithNonFinite } from '@shared/json-numbers.ts';

/** The server answered with an error (the one error shape), or with something unreadable. */
export class ApiRequestError extends Error {
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'bad-answer',
    message: string,
    readonly details?: unknown,
  ) {
    super(message);
  }
}

/** Nothing answered at the server's address (refused, unknown host, reset). */
export class ServerUnreachableError extends Error {}

export interface SubmitApiClient {
  readonly serverUrl: string;
  /** Every team the token's owner belongs to. */
  teams(): Promise<TeamSummary[]>;
  /** Every routine of a team. */
  routines(teamId: number): Promise<RoutineSummary[]>;
  submitCandidate(
    routineId: number,
    body: { title: string; description?: string; source: string },
  ): Promise<Submission>;
  candidate(candidateId: number): Promise<CandidateDetail>;
  submitRevision(candidateId: number, body: { source: string }): Promise<Submission>;
  trial(trialId: number): Promise<TrialDetail>;
  /** `GET` the trial's server-sent events; the caller reads the body. */
  trialEvents(trialId: number, signal: AbortSignal): Promise<Response>;
}

/**
 * The calls the submit command makes, over fetch with the Bearer token, each answer checked
 * against the shared zod schema. Errors come back as ApiRequestError with the server's code and
 * message, so the command can print them as they are.
 */
export function createSubmitApiClient(serverUrl: string, token: string): SubmitApiClient {
  const send = async (path: string, init: RequestInit = {}): Promise<Response> => {
    const headers = new Headers(init.headers);
    headers.set('authorization', `Bearer ${token}`);
    headers.set('accept', headers.get('accept') ?? 'application/json');
    if (init.body !== undefined) headers.set('content-type', 'application/json');
    try {
      return await fetch(`${serverUrl}/api${path}`, { ...init, headers });
    } catch (err) {
      if (init.signal?.aborted) throw err;
      const cause = (err as { cause?: { code?: string; message?: string } }).cause;
      const why = cause?.code ?? cause?.message ?? (err as Error).message;
      throw new ServerUnreachableError(`Could not reach the server at ${serverUrl} (${why}).`);
    }
  };

  const read = async <S extends z.ZodType>(res: Response, schema: S): Promise<z.infer<S>> => {
    const text = await res.text();
    let body: unknown;
    try {
      body = text === '' ? null : parseWithNonFinite(text);
    } catch {
      throw new ApiRequestError(
        res.status,
        'bad-answer',
        `The server answered ${res.status} with something that is not JSON; is ${serverUrl} a Stablehand server?`,
      );
    }
    if (!res.ok) {
      const error = apiErrorSchema.safeParse(body);
      if (error.success) {
        const { code, message, details } = error.data.error;
        throw new ApiRequestError(res.status, code, message, details);
      }
      throw new ApiRequestError(res.status, 'bad-answer', `The server answered ${res.status}.`);
    }
    const parsed = schema.safeParse(body);
    if (!parsed.success) {
      throw new ApiRequestError(
        res.status,
        'bad-answer',
        `The server's answer to ${res.url} is not what this command expects (a different version?).`,
      );
    }
    return parsed.data;
  };

  /** Every item of a paged list, page by page. */
  const everyPage = async <T>(
    path: string,
    schema: z.ZodType<{ items: T[]; total: number }>,
  ): Promise<T[]> => {
    const items: T[] = [];
    for (;;) {
      const page = await read(await send(`${path}?limit=100&offset=${items.length}`), schema);
      items.push(...page.items);
      if (page.items.length === 0 || items.length >= page.total) return items;
    }
  };

  return {
    serverUrl,
    teams: () => everyPage('/teams', teamPageSchema),
    routines: (teamId) => everyPage(`/teams/${teamId}/routines`, routinePageSchema),
    submitCandidate: async (routineId, body) =>
      read(
        await send(`/routines/${routineId}/candidates`, {
          method: 'POST',
          body: JSON.stringify(body),
        }),
        submissionSchema,
      ),
    candidate: async (candidateId) =>
      read(await send(`/candidates/${candidateId}`), candidateDetailSchema),
    submitRevision: async (candidateId, body) =>
      read(
        await send(`/candidates/${candidateId}/revisions`, {
          method: 'POST',
          body: JSON.stringify(body),
        }),
        submissionSchema,
      ),
    trial: async (trialId) => read(await send(`/trials/${trialId}`), trialDetailSchema),
    trialEvents: async (trialId, signal) => {
      const res = await send(`/trials/${trialId}/events`, {
        headers: { accept: 'text/event-stream' },
        signal,
      });
      if (!res.ok) await read(res, trialDetailSchema);
      return res;
    },
  };
}
