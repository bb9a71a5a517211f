import type { QueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router';
import { Alert } from '@console/components/ui/alert';
import { useNotify } from '@console/components/ui/notifications';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { paths } from '@console/config/paths';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getMasksQueryOptions } from '@console/features/masks/api/get-masks';
import { DeriveMaskForm } from '@console/features/masks/components/derive-mask-form';
import { MaskPointsForm } from '@console/features/masks/components/mask-points-form';
import { MasksTable } from '@console/features/masks/components/masks-table';
import { hasPermission } from '@console/lib/authorization';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, 'masks:read')) void queryClient.prefetchInfiniteQuery(getMasksQueryOptions());
  return null;
};

export default function MasksRoute() {
  const { data: session } = useSession();
  const navigate = useNavigate();
  const notify = useNotify();
  if (!session) return null;
  const canWrite = hasPermission(session, 'masks:write');
  const opened = (maskId: string, message: string) => {
    notify(message);
    navigate(paths.app.mask.getHref(maskId));
  };

  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Masks"
        description="Tolerance masks judge each unit’s response: pass inside the band, fail outside it. Every change is a new version."
      />
      <div className="space-y-6">
        <Panel title="Masks" flush>
          <MasksTable canCreate={canWrite} />
        </Panel>
        {canWrite ? (
          <>
            <Panel id="create-mask" title="Create a mask from points" description="One row per frequency with its lower and upper limit.">
              <MaskPointsForm mode="create" onCreated={(mask) => opened(mask.id, `Mask “${mask.name}” created.`)} />
            </Panel>
            <Panel id="derive-mask" title="Derive a mask from golden units" description="Pick analyses of known-good units; the limits follow their spread.">
              <DeriveMaskForm onDerived={(mask) => opened(mask.id, `Mask “${mask.name}” derived from ${mask.current.derivation?.curveCount ?? 'the'} golden units.`)} />
            </Panel>
          </>
        ) : (
          <Alert tone="info" title="Your role does not create masks">
            Analysts, admins and owners of {session.activeOrganisation.name} create and change masks.
          </Alert>
        )}
      </div>
    </>
  );
}
