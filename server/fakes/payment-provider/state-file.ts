import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { dirname } from 'node:path';
import type { ProviderState } from './state';

const FORMAT_VERSION = 1;
// The event log only helps with "resend"; an endless dev run should not grow the file without bound.
const MAX_EVENTS_KEPT = 500;

const PERSISTED_MAPS = ['products', 'prices', 'customers', 'subscriptions', 'invoices', 'checkoutSessions', 'portalSessions'] as const;

type PersistedMapName = (typeof PERSISTED_MAPS)[number];
type SavedState = { formatVersion: number; events: ProviderState['events'] } & Record<PersistedMapName, [string, unknown][]>;

/**
 * Keeps the fake's objects across restarts of `npm start`, so customer and subscription ids stored in our
 * database stay valid. Tests run without a file and start from the seeded catalogue every time.
 */
export function loadStateFile(path: string, state: ProviderState): boolean {
  if (!existsSync(path)) return false;
  const saved = JSON.parse(readFileSync(path, 'utf8')) as SavedState;
  if (saved.formatVersion !== FORMAT_VERSION) return false;
  for (const name of PERSISTED_MAPS) {
    const target = state[name] as Map<string, unknown>;
    target.clear();
    for (const [id, object] of saved[name] ?? []) target.set(id, object);
  }
  state.events = saved.events ?? [];
  return true;
}

export function saveStateFile(path: string, state: ProviderState): void {
  const saved = {
    formatVersion: FORMAT_VERSION,
    events: state.events.slice(-MAX_EVENTS_KEPT),
    ...Object.fromEntries(PERSISTED_MAPS.map((name) => [name, [...(state[name] as Map<string, unknown>)]])),
  };
  mkdirSync(dirname(path), { recursive: true });
  // Write then rename, so a crash mid-write never leaves a half file behind.
  const temporaryPath = `${path}.${process.pid}.tmp`;
  writeFileSync(temporaryPath, JSON.stringify(saved));
  renameSync(temporaryPath, path);
}
