import { Badge, type BadgeTone } from '@console/components/ui/badge';
import type { Calibration } from '@shared/schemas/calibrations';

const tone: Record<Calibration['status'], BadgeTone> = { valid: 'ok', expired: 'danger', not_yet_valid: 'neutral' };
const mark: Record<Calibration['status'], string> = { valid: '✓', expired: '⚠', not_yet_valid: '◷' };
const words: Record<Calibration['status'], string> = { valid: 'Valid', expired: 'Expired', not_yet_valid: 'Not yet valid' };

/** The word carries the state; the mark and colour only repeat it. */
export function CalibrationStatusBadge({ status }: { status: Calibration['status'] }) {
  return (
    <Badge tone={tone[status]}>
      <span aria-hidden="true">{mark[status]}</span>
      {words[status]}
    </Badge>
  );
}
