import { TERMINAL_STATUSES, type AnalysisStatus } from '@shared/schemas/analyses';

/** How often to ask again while jobs run; the API's Retry-After on a running job says 2 s. */
export const POLL_INTERVAL_MS = 2000;

export const isTerminal = (status: AnalysisStatus) => TERMINAL_STATUSES.includes(status);

/** 2 s while any of the shown jobs is queued or running; false (stop polling) once all have finished. */
export function pollIntervalMs(statuses: readonly AnalysisStatus[]): number | false {
  return statuses.some((status) => !isTerminal(status)) ? POLL_INTERVAL_MS : false;
}
