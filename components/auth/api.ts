import { apiRequest, rememberCsrfToken } from '@/components/api/client';
import { sessionResponseSchema, type SessionResponse } from '@/shared/schemas/session';

/** GET /api/auth/session: who is signed in, the CSRF token and the sign-in providers. */
export async function fetchSession(): Promise<SessionResponse> {
  const session = await apiRequest('GET', '/api/auth/session', { schema: sessionResponseSchema });
  rememberCsrfToken(session.csrfToken);
  return session;
}

/** POST /api/auth/sign-out, or /api/auth/sign-out-everywhere to end every session of this person. */
export async function signOut(scope: 'this-session' | 'everywhere'): Promise<void> {
  await apiRequest('POST', scope === 'everywhere' ? '/api/auth/sign-out-everywhere' : '/api/auth/sign-out');
  // The old session's token is void now; the next session fetch brings a fresh one.
  rememberCsrfToken(null);
}
