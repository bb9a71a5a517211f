import { sql } from 'drizzle-orm';
import type { Health } from '@shared/schemas/health';
import type { AppDeps } from '@server/deps';

const DATABASE_TIMEOUT_MS = 2000;

async function databaseLatencyMs(deps: AppDeps): Promise<number | null> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    await Promise.race([
      deps.db.execute(sql`SELECT 1`),
      new Promise((_, reject) => {
        timer = setTimeout(() => reject(new Error('database ping timed out')), DATABASE_TIMEOUT_MS);
      }),
    ]);
    return Math.round((performance.now() - started) * 10) / 10;
  } catch (error) {
    deps.logger.warn({ err: error }, 'health check: database unavailable');
    return null;
  } finally {
    clearTimeout(timer);
  }
}

export async function checkHealth(deps: AppDeps): Promise<Health> {
  const latencyMs = await databaseLatencyMs(deps);
  const databaseUp = latencyMs !== null;
  return {
    status: databaseUp ? 'ok' : 'degraded',
    database: { status: databaseUp ? 'ok' : 'unavailable', latencyMs },
    version: deps.config.version,
  };
}
