import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { Panel } from '@console/components/ui/panel';
import { EmptyState } from '@console/components/ui/states';
import { paths } from '@console/config/paths';
import { formatDate } from '@console/utils/format-date';
import { useCalibrations } from '../api/get-calibrations';
import { calibrationsNeedingAttention, EXPIRY_NOTICE_DAYS, nextCalibrationEnd, type CalibrationAttention } from '../utils/calibration-attention';
import { CardQuery, NotForRole } from './card-states';

const SHOWN = 4;

function days(count: number): string {
  return `${count} day${count === 1 ? '' : 's'}`;
}

function stateWords(item: CalibrationAttention): { badge: string; tone: 'danger' | 'warning' | 'neutral'; detail: string } {
  const until = item.calibration.validUntil ? formatDate(item.calibration.validUntil) : '';
  if (item.state === 'expired') return { badge: 'Expired', tone: 'danger', detail: `Ended ${until}; no valid calibration left for this input.` };
  if (item.state === 'expiring') return { badge: `Ends in ${days(Math.max(item.daysLeft, 0))}`, tone: 'warning', detail: `Valid until ${until}.` };
  return { badge: 'Replaced', tone: 'neutral', detail: `Ended ${until}; a later calibration of this input is in force.` };
}

/** Rig inputs whose calibration ran out or runs out soon: absolute levels (dB SPL) depend on them. */
export function CalibrationsCard({ canRead }: { canRead: boolean }) {
  const query = useCalibrations(canRead);
  return (
    <Panel
      id="overview-calibrations"
      title="Calibrations"
      description={`Expired, or ending within ${EXPIRY_NOTICE_DAYS} days.`}
      flush
      actions={
        canRead && (
          <Link to={paths.app.calibrations.getHref()} className="text-sm font-semibold text-ink-700 underline underline-offset-2 hover:text-ink-900">
            All calibrations
          </Link>
        )
      }
    >
      {!canRead ? (
        <NotForRole>Your role does not read calibrations.</NotForRole>
      ) : (
        <CardQuery query={query} loadingLabel="Loading calibrations…">
          {(page) => {
            if (page.data.length === 0) {
              return <EmptyState title="No calibrations yet">Without one, levels are relative (dBFS), not dB SPL.</EmptyState>;
            }
            const attention = calibrationsNeedingAttention(page.data);
            const next = nextCalibrationEnd(page.data);
            return (
              <div>
                {attention.length === 0 ? (
                  <p className="px-5 pt-4 text-sm font-semibold text-ok-700">Every calibration holds for the next {EXPIRY_NOTICE_DAYS} days.</p>
                ) : (
                  <ul className="divide-y divide-ink-100" aria-label="Calibrations needing attention">
                    {attention.slice(0, SHOWN).map((item) => {
                      const words = stateWords(item);
                      return (
                        <li key={item.calibration.id} className="flex items-start justify-between gap-3 px-5 py-2.5">
                          <span className="min-w-0">
                            <span className="block truncate font-mono text-sm font-semibold text-ink-900">
                              {item.calibration.rigId} · input {item.calibration.inputChannel}
                            </span>
                            <span className="block text-xs text-ink-600">{words.detail}</span>
                          </span>
                          <Badge tone={words.tone}>{words.badge}</Badge>
                        </li>
                      );
                    })}
                  </ul>
                )}
                <p className="border-t border-ink-100 px-5 py-3 text-xs text-ink-600">
                  {next?.validUntil
                    ? `Next to end: ${next.rigId} · input ${next.inputChannel}, on ${formatDate(next.validUntil)}.`
                    : 'No valid calibration has an end date.'}{' '}
                  Follow your lab’s calibration procedure; a calibrator tone is loud at the ear.
                </p>
              </div>
            );
          }}
        </CardQuery>
      )}
    </Panel>
  );
}
