import type { TeamRole } from '@shared/roles.ts';
import { AppError } from '@server/http/errors.ts';

/** Only maintainers promote, reinstate, and see the list of cleared candidates to promote. */
export function mayPromote(role: TeamRole): boolean {
  return role === 'maintainer';
}

export function requirePromote(role: TeamRole, action: string): void {
  if (!mayPromote(role)) {
    throw new AppError('forbidden', `Only maintainers ${action}; you are ${role}.`);
  }
}
