import type { Request, Response } from 'express';
import { permissionsOfRole } from '@shared/schemas/permissions';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import type { RouteAccess } from '@server/http/define-route';
import type { Principal, SignedInUser } from '@server/http/principal';
import { authenticateApiKey } from '@server/modules/api-keys/api-key-auth';
import {
  clearSessionCookie,
  issueSessionToken,
  SESSION_COOKIE,
  setSessionCookie,
  shouldRefresh,
  verifySessionToken,
  type SessionClaims,
} from './session-token';
import { refuseRevokedSession } from './session-revocation';
import { findMembershipOfUser, findUserById } from './users.repo';

const notAuthenticated = (detail: string) => new ApiProblem('not_authenticated', detail);

async function sessionClaimsFrom(deps: AppDeps, req: Request, res: Response): Promise<SessionClaims> {
  const token = (req.cookies as Record<string, string> | undefined)?.[SESSION_COOKIE];
  if (!token) throw notAuthenticated('Sign in, or send an API key as "Authorization: Bearer swl_live_…".');
  try {
    const claims = verifySessionToken(deps, token);
    await refuseRevokedSession(deps, claims);
    return claims;
  } catch (error) {
    clearSessionCookie(res, deps);
    throw error;
  }
}

function refreshIfDue(deps: AppDeps, res: Response, claims: SessionClaims): Date {
  if (!shouldRefresh(deps, claims)) return new Date(claims.expiresAtSeconds * 1000);
  const session = issueSessionToken(deps, {
    sessionId: claims.sessionId,
    userId: claims.userId,
    organisationId: claims.organisationId,
    authTimeSeconds: claims.authTimeSeconds,
  });
  setSessionCookie(res, deps, session);
  return session.expiresAt;
}

async function signedInUser(deps: AppDeps, req: Request, res: Response): Promise<SignedInUser> {
  const claims = await sessionClaimsFrom(deps, req, res);
  const user = await findUserById(deps.db, claims.userId);
  if (!user) {
    clearSessionCookie(res, deps);
    throw notAuthenticated('The account of this session no longer exists.');
  }
  const expiresAt = refreshIfDue(deps, res, claims);
  return { userId: user.id, sessionId: claims.sessionId, activeOrganisationId: claims.organisationId, authTimeSeconds: claims.authTimeSeconds, expiresAt };
}

/** The membership is read on every request, so a removed member or changed role takes effect at once. */
async function principalFromSession(deps: AppDeps, req: Request, res: Response): Promise<Principal> {
  const claims = await sessionClaimsFrom(deps, req, res);
  const [user, membership] = await Promise.all([
    findUserById(deps.db, claims.userId),
    findMembershipOfUser(deps.db, claims.organisationId, claims.userId),
  ]);
  if (!user || !membership) {
    throw notAuthenticated('You are no longer a member of the active organisation. Choose another organisation or sign in again.');
  }
  refreshIfDue(deps, res, claims);
  return {
    organisationId: membership.organisationId,
    permissions: new Set(permissionsOfRole(membership.role)),
    actor: { type: 'user', id: user.id, label: user.displayName, membershipId: membership.membershipId, role: membership.role },
  };
}

function bearerToken(authorization: string): string {
  const match = /^Bearer[ ]+(\S+)\s*$/i.exec(authorization);
  if (!match) throw new ApiProblem('invalid_api_key', 'The Authorization header must be "Bearer <API key>".');
  return match[1];
}

function refuseMissingPermission(principal: Principal, permission: string): never {
  if (principal.actor.type === 'api_key') {
    throw new ApiProblem('insufficient_scope', `This API key lacks the scope "${permission}".`, {
      extensions: { requiredPermission: permission },
    });
  }
  throw new ApiProblem('insufficient_permission', `Your role (${principal.actor.role}) does not include "${permission}".`, {
    extensions: { requiredPermission: permission },
  });
}

/**
 * Resolves who is calling, as the route's access rule requires. An Authorization header always wins over a
 * cookie, so a rig's request is never judged by a browser session and vice versa.
 */
export async function authenticate(
  deps: AppDeps,
  req: Request,
  res: Response,
  access: RouteAccess,
): Promise<{ principal?: Principal; user?: SignedInUser }> {
  if (access.kind === 'public') return {};
  const authorization = req.get('authorization');
  if (access.kind === 'session') {
    if (authorization) throw notAuthenticated('This endpoint is for console sessions; API keys cannot use it.');
    return { user: await signedInUser(deps, req, res) };
  }
  let principal: Principal;
  if (authorization) {
    principal = await authenticateApiKey(deps, bearerToken(authorization));
  } else if (access.kind === 'api_key') {
    throw notAuthenticated('This endpoint describes the calling API key: send it as "Authorization: Bearer swl_live_…".');
  } else {
    principal = await principalFromSession(deps, req, res);
  }
  if (access.kind === 'permission' && !principal.permissions.has(access.permission)) {
    refuseMissingPermission(principal, access.permission);
  }
  return { principal };
}
