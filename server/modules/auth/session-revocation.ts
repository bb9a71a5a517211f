import { eq, lt } from 'drizzle-orm';
import type { AppDeps } from '@server/deps';
import { ApiProblem } from '@server/http/api-problem';
import { revokedSessions } from '@server/db/tables';
import type { SessionClaims } from './session-token';

/** Pruning deletes at most this many expired rows per sign-out, so one request never does a large delete. */
const PRUNE_BATCH = 500;

/**
 * Ends a console session for every server process: its id is refused from now on, even from a copied cookie.
 * The row lives until the session could have expired anyway (sign-in + maximum session age).
 */
export async function revokeSession(deps: AppDeps, claims: SessionClaims): Promise<void> {
  const now = deps.clock.now();
  const expiresAt = new Date((claims.authTimeSeconds + deps.config.sessionMaxAgeSeconds) * 1000);
  await deps.db
    .insert(revokedSessions)
    .values({ sessionId: claims.sessionId, userId: claims.userId, expiresAt, createdAt: now })
    .onDuplicateKeyUpdate({ set: { sessionId: claims.sessionId } });
  await deps.db.delete(revokedSessions).where(lt(revokedSessions.expiresAt, now)).limit(PRUNE_BATCH);
}

/** Refuses a session that was signed out; one primary-key lookup per console request. */
export async function refuseRevokedSession(deps: AppDeps, claims: SessionClaims): Promise<void> {
  const [revoked] = await deps.db
    .select({ sessionId: revokedSessions.sessionId })
    .from(revokedSessions)
    .where(eq(revokedSessions.sessionId, claims.sessionId))
    .limit(1);
  if (revoked) throw new ApiProblem('not_authenticated', 'This session was signed out. Sign in again.');
}
