import { useState } from 'react';
import type { QueryClient } from '@tanstack/react-query';
import { Alert } from '@console/components/ui/alert';
import { PageHeader } from '@console/components/ui/page-header';
import { Panel } from '@console/components/ui/panel';
import { useSession } from '@console/features/auth/api/get-session';
import { getStimuliQueryOptions } from '@console/features/stimuli/api/get-stimuli';
import { CreateStimulusForm } from '@console/features/stimuli/components/create-stimulus-form';
import { StimuliTable } from '@console/features/stimuli/components/stimuli-table';
import { StimulusDownloadDialog } from '@console/features/stimuli/components/stimulus-download-dialog';
import { hasPermission } from '@console/lib/authorization';
import type { Stimulus } from '@shared/schemas/stimuli';

export const clientLoader = (queryClient: QueryClient) => () => {
  void queryClient.prefetchInfiniteQuery(getStimuliQueryOptions());
  return null;
};

export default function StimuliRoute() {
  const { data: session } = useSession();
  const [open, setOpen] = useState<{ stimulus: Stimulus; justCreated: boolean } | null>(null);
  if (!session) return null;
  const canCreate = hasPermission(session, 'analyses:write');

  return (
    <>
      <PageHeader
        eyebrow="Workspace"
        title="Stimuli"
        description="Test signals defined by their parameters. Rigs play the WAV; analyses regenerate the same signal to read the capture."
      />
      <div className="space-y-6">
        {canCreate ? (
          <Panel title="Create a stimulus" description="Start at a low level: the default peak is −20 dBFS.">
            <CreateStimulusForm onCreated={(stimulus) => setOpen({ stimulus, justCreated: true })} />
          </Panel>
        ) : (
          <Alert tone="info" title="Read-only for your role">
            Analysts, admins and owners of {session.activeOrganisation.name} create stimuli; you can download them.
          </Alert>
        )}
        <Panel title="Stimuli" description="Each download comes with the safety cautions for playing it." flush>
          <StimuliTable
            onOpen={(stimulus) => setOpen({ stimulus, justCreated: false })}
            emptyHint={canCreate ? 'Create one above; the rig examples also create one per run.' : 'None has been created in this organisation yet.'}
          />
        </Panel>
      </div>
      <StimulusDownloadDialog stimulus={open?.stimulus ?? null} justCreated={open?.justCreated} onClose={() => setOpen(null)} />
    </>
  );
}
