import type { Request, Response } from 'express';
import type { AppDeps } from '@server/deps';
import { revokeSession } from './session-revocation';
import { clearSessionCookie, SESSION_COOKIE, verifySessionToken } from './session-token';

/**
 * Revokes the session the cookie names (when it is still a valid one) and clears the cookie. An absent, expired
 * or forged cookie has nothing to revoke; sign-out still succeeds, so a console can always leave cleanly.
 */
export async function signOut(deps: AppDeps, req: Request, res: Response): Promise<void> {
  const token = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  clearSessionCookie(res, deps);
  if (!token) return;
  let claims;
  try {
    claims = verifySessionToken(deps, token);
  } catch {
    return;
  }
  await revokeSession(deps, claims);
}
