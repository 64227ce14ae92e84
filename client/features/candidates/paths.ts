import { paths } from '@client/app/paths.ts';

/**
 * Addresses of the candidate pages for other features (the review page links to `revisePath`
 * for "submit a new revision"; the submit page links back to `candidatePath`).
 */
export const candidatePath = paths.candidate;
/** `/teams/:teamSlug/candidates/:candidateId/revise`: the editor for a new revision. */
export const revisePath = paths.revise;
/** `/teams/:teamSlug/routines/:routineId/submit`: the editor for a new candidate. */
export const submitPath = paths.submit;
