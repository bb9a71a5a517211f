import type { QueryClient } from '@tanstack/react-query';
import { Link, useParams, useSearchParams, type LoaderFunctionArgs } from 'react-router';
import { buttonClasses } from '@console/components/ui/button';
import { useNotify } from '@console/components/ui/notifications';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { ErrorState, LoadingState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { useSession } from '@console/features/auth/api/get-session';
import { getMaskQueryOptions, getMaskVersionsQueryOptions, useMask, useMaskVersions } from '@console/features/masks/api/get-mask';
import { DeriveMaskForm } from '@console/features/masks/components/derive-mask-form';
import { MaskBandChart } from '@console/features/masks/components/mask-band-chart';
import { MaskPointsForm } from '@console/features/masks/components/mask-points-form';
import { MaskVersionsList } from '@console/features/masks/components/mask-versions-list';
import { hasPermission } from '@console/lib/authorization';

export const clientLoader =
  (queryClient: QueryClient) =>
  ({ params }: LoaderFunctionArgs) => {
    if (params.maskId) {
      void queryClient.prefetchQuery(getMaskQueryOptions(params.maskId));
      void queryClient.prefetchQuery(getMaskVersionsQueryOptions(params.maskId));
    }
    return null;
  };

export default function MaskDetailRoute() {
  const { maskId = '' } = useParams();
  const [searchParams, setSearchParams] = useSearchParams();
  const { data: session } = useSession();
  const notify = useNotify();
  const mask = useMask(maskId);
  const versions = useMaskVersions(maskId);
  const canWrite = hasPermission(session, 'masks:write');

  if (mask.isPending) return <LoadingState label="Loading the mask…" />;
  if (mask.isError) return <ErrorState error={mask.error} onRetry={() => mask.refetch()} />;
  const requested = Number(searchParams.get('version'));
  const shown = versions.data?.data.find((version) => version.version === requested) ?? mask.data.current;
  const showLatest = () => setSearchParams(new URLSearchParams());

  return (
    <>
      <PageHeader
        eyebrow="Masks"
        title={mask.data.name}
        description={<span className="font-mono text-xs">{mask.data.id}</span>}
        actions={
          <Link to={paths.app.masks.getHref()} className={buttonClasses('secondary', 'sm')}>
            All masks
          </Link>
        }
      />
      <div className="space-y-6">
        <Panel
          id="mask-band"
          title={`Version ${shown.version}${shown.version === mask.data.latestVersion ? ' (current)' : ''}`}
          description={shown.derivation ? shown.derivation.description : (shown.note ?? 'Entered points.')}
        >
          <MaskBandChart name={`${mask.data.name} version ${shown.version}`} lines={shown} heightPx={320} />
        </Panel>
        <Panel title="Versions" description="Analyses name the version they were judged against; earlier versions stay as they were." flush>
          {versions.isPending ? (
            <LoadingState label="Loading versions…" />
          ) : versions.isError ? (
            <ErrorState error={versions.error} onRetry={() => versions.refetch()} />
          ) : (
            <MaskVersionsList maskId={maskId} versions={versions.data.data} shownVersion={shown.version} latestVersion={mask.data.latestVersion} />
          )}
        </Panel>
        {canWrite && (
          <>
            <Panel id="new-version" title="New version from points" description="Starts from the current version’s points when it has few enough to edit.">
              <MaskPointsForm
                key={mask.data.latestVersion}
                mode="version"
                maskId={maskId}
                current={mask.data.current}
                onCreated={(version) => {
                  notify(`Version ${version.version} saved.`);
                  showLatest();
                }}
              />
            </Panel>
            <Panel id="derive-version" title="New version from golden units">
              <DeriveMaskForm
                maskId={maskId}
                onDerived={(derived) => {
                  notify(`Version ${derived.latestVersion} derived.`);
                  showLatest();
                }}
              />
            </Panel>
          </>
        )}
      </div>
    </>
  );
}
