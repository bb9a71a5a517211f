import { runAnalysis } from './engine/run-analysis';
import type { EngineTask, EngineTaskOutput } from './engine/job-spec';

/** Runs in a piscina worker thread: the engine's CPU work never blocks the HTTP event loop. */
export default function engineWorker(task: EngineTask): EngineTaskOutput {
  return runAnalysis(task);
}
