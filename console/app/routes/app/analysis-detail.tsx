import type { QueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { Button, buttonClasses } from '@console/components/ui/button';
import { useNotify } from '@console/components/ui/notifications';
import { PageHeader } from '@console/components/ui/page-header';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { useSession } from '@console/features/auth/api/get-session';
import { useCancelAnalysis } from '@console/features/analyses/api/cancel-analysis';
import { getAnalysisQueryOptions, useAnalysis } from '@console/features/analyses/api/get-analysis';
import { AnalysisSummary } from '@console/features/analyses/components/analysis-summary';
import { BesideComparison } from '@console/features/analyses/components/beside-comparison';
import { ConventionsBlock } from '@console/features/analyses/components/conventions-block';
import { DistortionPlots } from '@console/features/analyses/components/distortion-plots';
import { DownloadsPanel } from '@console/features/analyses/components/downloads-panel';
import { FiguresPanel } from '@console/features/analyses/components/figures-panel';
import { RerunForm } from '@console/features/analyses/components/rerun-form';
import { ResponsePlots } from '@console/features/analyses/components/response-plots';
import { WarningsList } from '@console/features/analyses/components/warnings-list';
import { deviceName } from '@console/features/analyses/utils/labels';
import { isTerminal } from '@console/features/analyses/utils/polling';
import { resultOf } from '@console/features/analyses/utils/result-view';
import { hasPermission } from '@console/lib/authorization';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.analysisId) void queryClient.prefetchQuery(getAnalysisQueryOptions(params.analysisId));
    return null;
  };

export default function AnalysisDetailRoute() {
  const { analysisId = '' } = useParams();
  const [searchParams] = useSearchParams();
  const besideId = searchParams.get('beside');
  const navigate = useNavigate();
  const notify = useNotify();
  const { data: session } = useSession();
  const analysis = useAnalysis(analysisId);
  const cancel = useCancelAnalysis();

  if (analysis.isPending) return <LoadingState label="Loading analysis…" />;
  if (analysis.isError) return <ErrorState error={analysis.error} onRetry={() => analysis.refetch()} />;

  const current = analysis.data;
  const result = resultOf(current);
  const canWrite = session ? hasPermission(session, 'analyses:write') : false;
  const running = !isTerminal(current.status);

  return (
    <>
      <PageHeader
        eyebrow="Analysis"
        title={deviceName(current.dut, current.id)}
        description={<span className="font-mono text-xs">{current.id}</span>}
        actions={
          <>
            <Link to={paths.app.analyses.getHref()} className={buttonClasses('ghost', 'sm')}>
              All analyses
            </Link>
            {canWrite && running && (
              <Button variant="ghost-danger" size="sm" isPending={cancel.isPending} onClick={() => cancel.mutate(current.id)}>
                Cancel job
              </Button>
            )}
          </>
        }
      />
      <div key={current.id} className="space-y-6">
        <AnalysisSummary analysis={current} />
        {besideId && besideId !== current.id && <BesideComparison analysis={current} besideId={besideId} />}
        {running && <LoadingState label={`The job is ${current.status}; this page updates when it finishes.`} />}
        {result && <WarningsList warnings={result.warnings} />}
        <div className="grid items-start gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
          <div className="min-w-0 space-y-6">
            {result && <ResponsePlots analysis={current} result={result} />}
            {result && <DistortionPlots result={result} />}
            {result && <ConventionsBlock conventions={result.conventions} />}
          </div>
          <div className="space-y-6">
            {result && <FiguresPanel analysis={current} result={result} />}
            <DownloadsPanel analysis={current} />
            {canWrite && current.status === 'succeeded' && (
              <RerunForm
                analysis={current}
                onQueued={(created) => {
                  notify(`Re-run ${created.id} queued.`);
                  navigate(paths.app.analysis.getHref(created.id, current.id));
                }}
              />
            )}
          </div>
        </div>
      </div>
    </>
  );
}
