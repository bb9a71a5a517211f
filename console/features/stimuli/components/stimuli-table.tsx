import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { formatDate, formatDateTime } from '@console/utils/format-date';
import type { Stimulus } from '@shared/schemas/stimuli';
import { useStimuli } from '../api/get-stimuli';
import { STIMULUS_TYPE_LABELS } from '../utils/stimulus-fields';
import { stimulusLength, stimulusLevel, stimulusRange, stimulusTitle } from '../utils/stimulus-display';

export function StimuliTable({ onOpen, emptyHint }: { onOpen: (stimulus: Stimulus) => void; emptyHint: string }) {
  const stimuli = useStimuli();

  if (stimuli.isPending) return <LoadingState label="Loading stimuli…" />;
  if (stimuli.isError) return <ErrorState error={stimuli.error} onRetry={() => stimuli.refetch()} />;

  const rows = stimuli.data.pages.flatMap((page) => page.data);
  if (rows.length === 0) return <EmptyState title="No stimuli yet">{emptyHint}</EmptyState>;

  return (
    <>
      <Table caption="Stimuli of this organisation, newest first">
        <thead>
          <tr>
            <Th>Stimulus</Th>
            <Th>Covers</Th>
            <Th>Peak level</Th>
            <Th>Length</Th>
            <Th>Created</Th>
            <Th>
              <span className="sr-only">Actions</span>
            </Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((stimulus) => (
            <tr key={stimulus.id} className="hover:bg-ink-50/60">
              <Td>
                <div className="font-semibold text-ink-900">{stimulusTitle(stimulus)}</div>
                <div className="text-xs text-ink-600">
                  {STIMULUS_TYPE_LABELS[stimulus.type]} · <span className="font-mono">{stimulus.id}</span>
                </div>
              </Td>
              <Td className="text-xs whitespace-nowrap">{stimulusRange(stimulus)}</Td>
              <Td className="tabular text-xs whitespace-nowrap">{stimulusLevel(stimulus)}</Td>
              <Td className="tabular text-xs whitespace-nowrap">{stimulusLength(stimulus)}</Td>
              <Td className="text-xs whitespace-nowrap">
                <time dateTime={stimulus.createdAt} title={formatDateTime(stimulus.createdAt)}>
                  {formatDate(stimulus.createdAt)}
                </time>
              </Td>
              <Td className="text-right">
                <Button variant="secondary" size="sm" aria-label={`Download ${stimulusTitle(stimulus)}`} onClick={() => onOpen(stimulus)}>
                  Download…
                </Button>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      {stimuli.hasNextPage && (
        <div className="flex justify-center border-t border-ink-100 px-5 py-3">
          <Button variant="secondary" size="sm" isPending={stimuli.isFetchingNextPage} onClick={() => stimuli.fetchNextPage()}>
            Show more stimuli
          </Button>
        </div>
      )}
    </>
  );
}
