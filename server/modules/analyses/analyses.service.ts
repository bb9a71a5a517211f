import type { AnalysisResult } from '@shared/dsp';
import type { AnalysisKind, AnalysisStatus, Dut } from '@shared/schemas/analyses';
import type { AppDeps } from '@server/deps';

/** One analysis as other modules read it (masks derived from golden units, production summaries). */
export interface AnalysisResultEntry {
  id: string;
  kind: AnalysisKind;
  status: AnalysisStatus;
  dut: Dut;
  tags: string[];
  createdAt: Date;
  /** The stored engine result; null unless status is succeeded. */
  result: AnalysisResult | null;
}

/**
 * Results of the given analyses of the organisation, in the order asked. Throws the not_found problem naming the
 * first id that does not exist in the organisation; analyses that have not succeeded come back with result null.
 */
export async function getAnalysisResults(deps: AppDeps, orgId: string, analysisIds: string[]): Promise<AnalysisResultEntry[]> {
  void deps;
  void orgId;
  void analysisIds;
  return [];
}
