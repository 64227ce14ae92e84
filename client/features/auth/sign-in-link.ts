/** The address that starts sign-in with the (fake, in development) GitHub provider. */
export function signInHref(returnTo?: string): string {
  return returnTo && returnTo.startsWith('/') && !returnTo.startsWith('//')
    ? `/auth/github?returnTo=${encodeURIComponent(returnTo)}`
    : '/auth/github';
}
