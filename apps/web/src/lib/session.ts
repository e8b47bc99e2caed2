import type { UserSummary } from '@/api/contract';

/** What Roundbook keeps in the browser between visits: the bearer token and who it belongs to. */
export interface Session {
  accessToken: string;
  expiresAt: string;
  user: UserSummary;
}

const SESSION_KEY = 'roundbook.session';

/** True once the session ended without the person signing out (token ran out or was refused). */
let ranOut = false;

function isSession(value: unknown): value is Session {
  if (typeof value !== 'object' || value === null) return false;
  const v = value as Record<string, unknown>;
  return typeof v.accessToken === 'string' && typeof v.expiresAt === 'string' && typeof v.user === 'object';
}

/** The stored session, or null when there is none or its token has run out. */
export function readSession(now: Date = new Date()): Session | null {
  let parsed: unknown;
  try {
    parsed = JSON.parse(window.localStorage.getItem(SESSION_KEY) ?? 'null');
  } catch {
    parsed = null;
  }
  if (!isSession(parsed)) return null;
  const expires = Date.parse(parsed.expiresAt);
  if (Number.isFinite(expires) && expires <= now.getTime()) {
    expireSession();
    return null;
  }
  return parsed;
}

export function saveSession(session: Session): void {
  ranOut = false;
  window.localStorage.setItem(SESSION_KEY, JSON.stringify(session));
}

/** The person signed out. */
export function clearSession(): void {
  ranOut = false;
  window.localStorage.removeItem(SESSION_KEY);
}

/** The session ended by itself: its time ran out, or the API refused the token (401). */
export function expireSession(): void {
  window.localStorage.removeItem(SESSION_KEY);
  ranOut = true;
}

export function sessionRanOut(): boolean {
  return ranOut;
}

export function getAccessToken(): string | null {
  return readSession()?.accessToken ?? null;
}
