import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { EmptyState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { paths } from '@console/config/paths';
import { formatDateTime } from '@console/utils/format-date';
import type { ProductionUnit } from '@shared/schemas/production';
import { sensitivityUnit, type SensitivityKind } from '../utils/sensitivity-kinds';

type FailingUnitsTableProps = { units: ProductionUnit[]; sensitivityKind: SensitivityKind | null };

/** The units that failed their mask, newest first, each linking to its analysis. */
export function FailingUnitsTable({ units, sensitivityKind }: FailingUnitsTableProps) {
  if (units.length === 0) return <EmptyState title="No failing units">Every unit judged against a mask in this selection passed.</EmptyState>;
  return (
    <Table caption="Units that failed their mask">
      <thead>
        <tr>
          <Th>Unit</Th>
          <Th>Verdict</Th>
          <Th>Measured</Th>
          <Th className="text-right">Sensitivity{sensitivityKind ? ` (${sensitivityUnit[sensitivityKind]})` : ''}</Th>
          <Th className="text-right">THD_F 1 kHz (%)</Th>
        </tr>
      </thead>
      <tbody>
        {units.map((unit) => {
          const sensitivity = sensitivityKind ? unit.sensitivity[sensitivityKind] : null;
          return (
            <tr key={unit.analysisId}>
              <Td>
                <Link to={paths.app.analysis.getHref(unit.analysisId)} className="font-semibold text-ink-900 underline underline-offset-2 hover:text-ink-700">
                  {unit.serial ?? 'Unnamed unit'}
                </Link>
                <div className="font-mono text-xs text-ink-500">{unit.analysisId}</div>
              </Td>
              <Td>
                <Badge tone="danger">
                  <span aria-hidden="true">✕</span>Fail
                </Badge>
              </Td>
              <Td className="whitespace-nowrap">
                <time dateTime={unit.createdAt}>{formatDateTime(unit.createdAt)}</time>
              </Td>
              <Td className="text-right font-mono tabular">{sensitivity === null ? '—' : sensitivity.toFixed(2)}</Td>
              <Td className="text-right font-mono tabular">{unit.thdFAtOneKilohertzPercent === null ? '—' : unit.thdFAtOneKilohertzPercent.toFixed(3)}</Td>
            </tr>
          );
        })}
      </tbody>
    </Table>
  );
}
