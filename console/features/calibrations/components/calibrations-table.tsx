import { Fragment } from 'react';
import { Badge } from '@console/components/ui/badge';
import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { cn } from '@console/utils/cn';
import { formatDate } from '@console/utils/format-date';
import type { Calibration } from '@shared/schemas/calibrations';
import { useCalibrations } from '../api/get-calibrations';
import { groupByRigInput } from '../utils/calibration-inputs';
import { CalibrationStatusBadge } from './calibration-status-badge';

const sourceLabel: Record<Calibration['source'], string> = {
  calibrator_capture: 'Calibrator capture',
  entered_dbfs: 'Entered dBFS',
  entered_microphone: 'Microphone mV/Pa',
};

const dbfs = (value: number) => `${value < 0 ? '\u2212' : ''}${Math.abs(value).toFixed(2)} dBFS`;

function SourceDetails({ calibration }: { calibration: Calibration }) {
  const details = calibration.details as Record<string, unknown>;
  const measured = typeof details.measuredFrequencyHz === 'number' ? `tone ${Number(details.measuredFrequencyHz).toFixed(1)} Hz` : null;
  const level = typeof details.statedLevelDbSpl === 'number' ? `${details.statedLevelDbSpl} dB SPL` : null;
  const mic = typeof details.microphoneMillivoltsPerPascal === 'number' ? `${details.microphoneMillivoltsPerPascal} mV/Pa` : null;
  const extra = [level, measured, mic].filter(Boolean).join(' · ');
  return (
    <div>
      <span className="whitespace-nowrap">{sourceLabel[calibration.source]}</span>
      {extra && <div className="text-xs text-ink-500">{extra}</div>}
    </div>
  );
}

/** Every calibration grouped by rig input; the one analyses use now is marked, expired ones stand out. */
export function CalibrationsTable() {
  const calibrations = useCalibrations();
  if (calibrations.isPending) return <LoadingState label="Loading calibrations…" />;
  if (calibrations.isError) return <ErrorState error={calibrations.error} onRetry={() => calibrations.refetch()} />;
  const all = calibrations.data.pages.flatMap((page) => page.data);
  if (all.length === 0) {
    return <EmptyState title="No calibrations yet">Without one, analyses report levels relative to full scale (dBFS) instead of dB SPL.</EmptyState>;
  }
  const inputs = groupByRigInput(all, new Date());
  return (
    <>
      <Table caption="Calibrations per rig input">
        <thead>
          <tr>
            <Th>Status</Th>
            <Th>Source</Th>
            <Th className="text-right">At 1 Pa</Th>
            <Th>Valid from</Th>
            <Th>Valid until</Th>
            <Th>Notes</Th>
          </tr>
        </thead>
        {inputs.map((input) => {
          const current = input.calibrations.find((c) => c.id === input.currentId);
          return (
            <Fragment key={`${input.rigId}-${input.inputChannel}`}>
              <tbody aria-label={`${input.rigId} input ${input.inputChannel}`}>
                <tr>
                  <th scope="rowgroup" colSpan={6} className="border-b border-ink-200 bg-ink-50/60 px-5 py-2 text-left text-sm font-bold text-ink-900">
                    <span className="font-mono">{input.rigId}</span> · input {input.inputChannel}
                    {current?.status === 'expired' && (
                      <span className="ml-2 text-xs font-semibold text-danger-700">
                        <span aria-hidden="true">⚠ </span>The calibration in use has expired: calibrate this input again.
                      </span>
                    )}
                    {!current && <span className="ml-2 text-xs font-normal text-ink-600">None has started yet.</span>}
                  </th>
                </tr>
                {input.calibrations.map((calibration) => (
                  <tr key={calibration.id} className={cn(calibration.status === 'expired' && 'bg-danger-50/50')}>
                    <Td className={cn(calibration.status === 'expired' && 'border-l-4 border-l-danger-600')}>
                      <div className="flex flex-wrap items-center gap-1.5">
                        <CalibrationStatusBadge status={calibration.status} />
                        {calibration.id === input.currentId && <Badge tone="accent">In use</Badge>}
                      </div>
                      <div className="mt-1 font-mono text-xs text-ink-500">{calibration.id}</div>
                    </Td>
                    <Td>
                      <SourceDetails calibration={calibration} />
                    </Td>
                    <Td className="text-right font-mono whitespace-nowrap tabular">{dbfs(calibration.dbfsAtOnePascal)}</Td>
                    <Td className="whitespace-nowrap">
                      <time dateTime={calibration.validFrom}>{formatDate(calibration.validFrom)}</time>
                    </Td>
                    <Td className={cn('whitespace-nowrap', calibration.status === 'expired' && 'font-semibold text-danger-700')}>
                      {calibration.validUntil ? <time dateTime={calibration.validUntil}>{formatDate(calibration.validUntil)}</time> : 'No end'}
                    </Td>
                    <Td className="max-w-64 text-xs text-ink-600">
                      {calibration.notes ?? '—'}
                      {calibration.warnings.length > 0 && (
                        <ul className="mt-1 font-semibold text-signal-800">
                          {calibration.warnings.map((warning) => (
                            <li key={warning.code}>{warning.message}</li>
                          ))}
                        </ul>
                      )}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Fragment>
          );
        })}
      </Table>
      {calibrations.hasNextPage && (
        <div className="px-5 py-3">
          <Button variant="secondary" size="sm" isPending={calibrations.isFetchingNextPage} onClick={() => calibrations.fetchNextPage()}>
            Load older calibrations
          </Button>
        </div>
      )}
    </>
  );
}
