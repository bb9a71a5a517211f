import type { AppDeps } from '@server/deps';
import { sha256Hex } from '@server/lib/crypto';
import { newId } from '@server/lib/ids';
import { ApiProblem } from '@server/http/api-problem';
import { deleteFailuresOfAccount, insertSignInFailure, nthRecentFailureAt, pruneFailuresBefore } from './sign-in-failures.repo';

/**
 * Failed sign-ins are counted per account and per client address over a sliding window (defaults: 5 per
 * account, 20 per address, 15 minutes) in MariaDB, so every server process shares the counts. While over a
 * limit every attempt is refused, even with the right password, and refused attempts do not extend the
 * lock. Concurrent attempts may overshoot a limit by the number in flight at once.
 */
export const accountKeyOf = (email: string) => sha256Hex(email);

export async function assertSignInAllowed(deps: AppDeps, accountKey: string, clientAddress: string): Promise<void> {
  const { windowSeconds, maxFailuresPerAccount, maxFailuresPerAddress } = deps.config.signInThrottle;
  const now = deps.clock.now();
  const since = new Date(now.getTime() - windowSeconds * 1000);
  const [accountLimitHitAt, addressLimitHitAt] = await Promise.all([
    nthRecentFailureAt(deps.db, { accountKey }, since, maxFailuresPerAccount),
    nthRecentFailureAt(deps.db, { clientAddress }, since, maxFailuresPerAddress),
  ]);
  const limitHitAt = [accountLimitHitAt, addressLimitHitAt].filter((at): at is Date => at !== undefined);
  if (limitHitAt.length === 0) return;
  const releaseAt = Math.max(...limitHitAt.map((at) => at.getTime() + windowSeconds * 1000));
  const retryAfterSeconds = Math.max(1, Math.ceil((releaseAt - now.getTime()) / 1000));
  throw new ApiProblem('sign_in_throttled', `Too many failed sign-in attempts. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`, {
    headers: { 'Retry-After': String(retryAfterSeconds) },
    extensions: { retryAfterSeconds },
  });
}

export async function recordSignInFailure(deps: AppDeps, accountKey: string, clientAddress: string): Promise<void> {
  const now = deps.clock.now();
  await insertSignInFailure(deps.db, { id: newId('signInFailure'), accountKey, clientAddress: clientAddress.slice(0, 64), createdAt: now });
  await pruneFailuresBefore(deps.db, new Date(now.getTime() - 24 * 3600 * 1000));
}

export async function clearSignInFailures(deps: AppDeps, accountKey: string): Promise<void> {
  await deleteFailuresOfAccount(deps.db, accountKey);
}
