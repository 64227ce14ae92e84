import type { CurrentUser } from '@server/auth/current-user.ts';

/**
 * Who may do what with API tokens. Anyone signed in (by session or by token) may create tokens
 * for themselves; the routes' `requireUser` is that check. A token acts with its owner's full
 * rights, so only the owner may revoke it: not even an admin can, and to everyone else it does
 * not exist.
 */
export function mayRevokeToken(user: CurrentUser, token: { userId: number }): boolean {
  return token.userId === user.id;
}
