import { EventEmitter } from 'node:events';

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

export function notifyJobFinished(analysisId: string): void {
  emitter.emit(`finished:${analysisId}`);
}

export function onJobFinished(analysisId: string, listener: () => void): () => void {
  emitter.on(`finished:${analysisId}`, listener);
  return () => emitter.off(`finished:${analysisId}`, listener);
}
