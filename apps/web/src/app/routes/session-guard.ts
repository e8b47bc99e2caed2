import { redirect } from 'react-router-dom';
import { signInPath } from '@/features/auth/utils/next-path';
import { isApiError } from '@/lib/api-client';
import { expireSession, readSession, sessionRanOut } from '@/lib/session';

/**
 * Runs a protected route's loader. Without a session, or when the API answers 401 (token expired
 * or revoked), it sends the person to sign-in with `?next=` pointing back at this page.
 */
export async function guarded<T>(request: Request, load: () => Promise<T>): Promise<T | Response> {
  const url = new URL(request.url);
  const returnTo = `${url.pathname}${url.search}`;
  if (readSession() === null) {
    // Another loader of the same navigation may already have seen the 401 and dropped the token.
    return redirect(signInPath(returnTo, sessionRanOut() ? 'expired' : undefined));
  }
  try {
    return await load();
  } catch (error) {
    if (isApiError(error) && error.status === 401) {
      expireSession();
      return redirect(signInPath(returnTo, 'expired'));
    }
    throw error;
  }
}
