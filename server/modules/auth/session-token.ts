import type { CookieOptions, Response } from 'express';
import jwt from 'jsonwebtoken';
import type { AppDeps } from '@server/deps';
import { deriveKey } from '@server/lib/crypto';
import { ApiProblem } from '@server/http/api-problem';
import { newId } from '@server/lib/ids';

export const SESSION_COOKIE = 'swl_session';
const ISSUER = 'sweepline';
const AUDIENCE = 'sweepline-console';

export interface SessionClaims {
  /** One id per sign-in, kept when the token is re-issued by use; sign-out revokes it. */
  sessionId: string;
  userId: string;
  organisationId: string;
  authTimeSeconds: number;
  issuedAtSeconds: number;
  expiresAtSeconds: number;
}

const keys = new Map<string, Buffer>();
function signingKey(secret: string): Buffer {
  let key = keys.get(secret);
  if (!key) {
    key = deriveKey(secret, 'session-token');
    keys.set(secret, key);
  }
  return key;
}

const nowSeconds = (deps: AppDeps) => Math.floor(deps.clock.now().getTime() / 1000);

/**
 * A session lasts `sessionLifetimeSeconds` from issue and is re-issued by use, but never past
 * `sessionMaxAgeSeconds` after the password sign-in (`authTimeSeconds`).
 */
export function issueSessionToken(
  deps: AppDeps,
  subject: { userId: string; organisationId: string; authTimeSeconds?: number; sessionId?: string },
): { token: string; expiresAt: Date } {
  const issuedAt = nowSeconds(deps);
  const authTime = subject.authTimeSeconds ?? issuedAt;
  const expiresAtSeconds = Math.min(issuedAt + deps.config.sessionLifetimeSeconds, authTime + deps.config.sessionMaxAgeSeconds);
  const token = jwt.sign(
    { sid: subject.sessionId ?? newId('session'), org: subject.organisationId, auth_time: authTime, iat: issuedAt, exp: expiresAtSeconds },
    signingKey(deps.config.sessionSecret),
    { algorithm: 'HS256', subject: subject.userId, issuer: ISSUER, audience: AUDIENCE },
  );
  return { token, expiresAt: new Date(expiresAtSeconds * 1000) };
}

export function verifySessionToken(deps: AppDeps, token: string): SessionClaims {
  try {
    const payload = jwt.verify(token, signingKey(deps.config.sessionSecret), {
      algorithms: ['HS256'],
      issuer: ISSUER,
      audience: AUDIENCE,
      clockTimestamp: nowSeconds(deps),
    });
    if (typeof payload === 'string' || typeof payload.sub !== 'string' || typeof payload.org !== 'string' || typeof payload.sid !== 'string') {
      throw new Error('bad claims');
    }
    return {
      sessionId: payload.sid,
      userId: payload.sub,
      organisationId: payload.org,
      authTimeSeconds: Number(payload.auth_time),
      issuedAtSeconds: Number(payload.iat),
      expiresAtSeconds: Number(payload.exp),
    };
  } catch (error) {
    if (error instanceof jwt.TokenExpiredError) {
      throw new ApiProblem('session_expired', 'Your session has expired. Sign in again.');
    }
    throw new ApiProblem('not_authenticated', 'The session cookie is not valid. Sign in again.');
  }
}

/** Re-issue when less than half the lifetime is left, so an active console stays signed in. */
export function shouldRefresh(deps: AppDeps, claims: SessionClaims): boolean {
  const remaining = claims.expiresAtSeconds - nowSeconds(deps);
  const canExtend = claims.authTimeSeconds + deps.config.sessionMaxAgeSeconds > claims.expiresAtSeconds;
  return canExtend && remaining < deps.config.sessionLifetimeSeconds / 2;
}

function cookieOptions(deps: AppDeps): CookieOptions {
  return {
    httpOnly: true,
    sameSite: 'lax',
    secure: deps.config.publicOrigin.startsWith('https:'),
    path: '/',
  };
}

export function setSessionCookie(res: Response, deps: AppDeps, session: { token: string; expiresAt: Date }): void {
  res.cookie(SESSION_COOKIE, session.token, { ...cookieOptions(deps), expires: session.expiresAt });
}

export function clearSessionCookie(res: Response, deps: AppDeps): void {
  res.clearCookie(SESSION_COOKIE, cookieOptions(deps));
}
