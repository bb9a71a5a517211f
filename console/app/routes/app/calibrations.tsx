import type { QueryClient } from '@tanstack/react-query';
import { Alert } from '@console/components/ui/alert';
import { useNotify } from '@console/components/ui/notifications';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { getSessionQueryOptions, useSession } from '@console/features/auth/api/get-session';
import { getCalibrationsQueryOptions } from '@console/features/calibrations/api/get-calibrations';
import { CalibrationsTable } from '@console/features/calibrations/components/calibrations-table';
import { CreateCalibrationForm } from '@console/features/calibrations/components/create-calibration-form';
import { hasPermission } from '@console/lib/authorization';

export const clientLoader = (queryClient: QueryClient) => async () => {
  const session = await queryClient.ensureQueryData(getSessionQueryOptions());
  if (hasPermission(session, 'calibrations:read')) void queryClient.prefetchInfiniteQuery(getCalibrationsQueryOptions());
  return null;
};

export default function CalibrationsRoute() {
  const { data: session } = useSession();
  const notify = useNotify();
  if (!session) return null;
  const canRead = hasPermission(session, 'calibrations:read');
  const canWrite = hasPermission(session, 'calibrations:write');

  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Calibrations"
        description="Chain sensitivity per rig input: what turns dBFS into dB SPL. An analysis naming a rig input uses the latest calibration valid at the time."
      />
      <div className="space-y-6">
        {canRead ? (
          <Panel title="Rig inputs" description="Grouped by rig and input channel, latest start first." flush>
            <CalibrationsTable />
          </Panel>
        ) : (
          <Alert tone="info" title="Your role does not read calibrations" />
        )}
        {canWrite ? (
          <Panel
            title="Create a calibration"
            description="Absolute levels are only as good as the calibration, and only for the microphone, preamp and gain it was made with."
          >
            <CreateCalibrationForm onCreated={(created) => notify(`Calibration ${created.id} created for ${created.rigId} input ${created.inputChannel}.`)} />
          </Panel>
        ) : (
          <Alert tone="info" title="Your role does not create calibrations">
            Analysts, admins and owners of {session.activeOrganisation.name} calibrate the rigs.
          </Alert>
        )}
      </div>
    </>
  );
}
