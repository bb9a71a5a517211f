import { EventEmitter } from 'node:events';
import type { AnalysisRow } from '@server/modules/analyses/analyses.repo';

/**
 * In-process signals between request handlers and the job runner: a new job (wake an idle runner now instead of
 * at its next poll) and a finished job (answer a waiting `Prefer: wait` request now). Other processes learn the
 * same facts from the database, by polling.
 */
const emitter = new EventEmitter();
emitter.setMaxListeners(0);

export function notifyJobQueued(): void {
  emitter.emit('queued');
}

export function onJobQueued(listener: () => void): () => void {
  emitter.on('queued', listener);
  return () => emitter.off('queued', listener);
}

/**
 * `row` is the finished row as this process just wrote it, when it has one: a waiting request answers from it
 * instead of reading the row (and its ~100 kB result) back from the database.
 */
export function notifyJobFinished(analysisId: string, row?: AnalysisRow): void {
  emitter.emit(`finished:${analysisId}`, row);
}

export function onJobFinished(analysisId: string, listener: (row: AnalysisRow | undefined) => void): () => void {
  emitter.on(`finished:${analysisId}`, listener);
  return () => emitter.off(`finished:${analysisId}`, listener);
}
