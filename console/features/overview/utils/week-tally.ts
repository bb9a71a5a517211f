import type { Analysis } from '@shared/schemas/analyses';

export type TalliedAnalysis = Pick<Analysis, 'id' | 'status' | 'verdict'>;

export interface AnalysisTally {
  /** Every analysis created in the period that was read. */
  total: number;
  pass: number;
  fail: number;
  /** Finished with a mask that the curve did not fully cover. */
  incomplete: number;
  /** Finished without a mask, so without a verdict. */
  noVerdict: number;
  /** Failed to run (an error, not a failing unit) or canceled. */
  notRun: number;
  /** Still queued or running. */
  inProgress: number;
  /** More analyses exist than were read: the counts are lower bounds. */
  truncated: boolean;
}

/** Counts a period's analyses by outcome; a verdict only counts for a finished analysis. */
export function tallyAnalyses(rows: readonly TalliedAnalysis[], truncated: boolean): AnalysisTally {
  const tally: AnalysisTally = { total: rows.length, pass: 0, fail: 0, incomplete: 0, noVerdict: 0, notRun: 0, inProgress: 0, truncated };
  for (const row of rows) {
    if (row.status === 'queued' || row.status === 'running') tally.inProgress++;
    else if (row.status === 'failed' || row.status === 'canceled') tally.notRun++;
    else if (row.verdict === 'pass') tally.pass++;
    else if (row.verdict === 'fail') tally.fail++;
    else if (row.verdict === 'incomplete') tally.incomplete++;
    else tally.noVerdict++;
  }
  return tally;
}

/** Share of passing units among those with a pass or fail verdict, in percent; null without any. */
export function passRatePercent(tally: Pick<AnalysisTally, 'pass' | 'fail'>): number | null {
  const judged = tally.pass + tally.fail;
  return judged === 0 ? null : (100 * tally.pass) / judged;
}
