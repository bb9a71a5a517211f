import { describe, expect, it } from 'vitest';
import { pollIntervalMs } from './polling';

// Polling stops once every shown job is terminal (TanStack Query docs, "Polling": refetchInterval may return false).
describe('job polling', () => {
  it('polls while any job is queued or running', () => {
    expect(pollIntervalMs(['succeeded', 'running'])).toBe(2000);
    expect(pollIntervalMs(['queued'])).toBe(2000);
  });

  it('stops when every job has finished, and when there is nothing to watch', () => {
    expect(pollIntervalMs(['succeeded', 'failed', 'canceled'])).toBe(false);
    expect(pollIntervalMs([])).toBe(false);
  });
});
