/**
 * Where to go after signing in. Only paths inside Roundbook are accepted (no other sites, no
 * protocol-relative `//host` tricks); anything else goes to the Board.
 */
export function safeNextPath(next: string | null | undefined): string {
  if (next === null || next === undefined) return '/';
  if (!next.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return '/';
  if (next.startsWith('/sign-in')) return '/';
  return next;
}

/** The sign-in address that brings the person back to `returnTo` afterwards. */
export function signInPath(returnTo: string, reason?: 'expired'): string {
  const params = new URLSearchParams();
  const next = safeNextPath(returnTo);
  if (next !== '/') params.set('next', next);
  if (reason !== undefined) params.set('reason', reason);
  const query = params.toString();
  return query === '' ? '/sign-in' : `/sign-in?${query}`;
}
