/**
 * The trial's inputs cannot be assembled, for a reason that a retry would not change (a matrix
 * set item that cannot be built, an unreadable upload, an invalid acceptance policy). The trial
 * ends as trial-failed with this message, without retries. Messages are plain words shown to
 * the team.
 */
export class TrialCannotRun extends Error {
  override name = 'TrialCannotRun';
}
