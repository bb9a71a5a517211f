import { createColumnHelper } from '@tanstack/react-table';
import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { paths } from '@console/config/paths';
import { formatDateTime, formatRelativeTime } from '@console/utils/format-date';
import type { AnalysisSummary } from '../api/get-analyses';
import { deviceName, kindLabel } from '../utils/labels';
import { StatusBadge, VerdictBadge } from './status-badge';

const column = createColumnHelper<AnalysisSummary>();

/** Margin to the mask in dB with its sign, so a negative (outside) margin reads as such. */
function formatMarginDb(marginDb: number): string {
  const rounded = Math.round(marginDb * 10) / 10;
  return `${rounded > 0 ? '+' : rounded < 0 ? '−' : ''}${Math.abs(rounded).toFixed(1)} dB`;
}

export const analysisColumns = [
  column.display({
    id: 'select',
    header: ({ table }) => (
      <input
        type="checkbox"
        className="size-4 accent-ink-700"
        aria-label="Select all loaded analyses"
        checked={table.getIsAllRowsSelected()}
        ref={(input) => {
          if (input) input.indeterminate = table.getIsSomeRowsSelected();
        }}
        onChange={table.getToggleAllRowsSelectedHandler()}
      />
    ),
    cell: ({ row }) => (
      <input
        type="checkbox"
        className="size-4 accent-ink-700"
        aria-label={`Select ${deviceName(row.original.dut, row.original.id)}`}
        checked={row.getIsSelected()}
        onChange={row.getToggleSelectedHandler()}
      />
    ),
    enableSorting: false,
  }),
  column.accessor((row) => `${row.dut.model ?? ''} ${row.dut.serial ?? ''}`, {
    id: 'device',
    header: 'Device',
    cell: ({ row }) => (
      <div>
        <Link to={paths.app.analysis.getHref(row.original.id)} className="font-semibold text-ink-900 underline-offset-2 hover:underline">
          {deviceName(row.original.dut, 'Unnamed device')}
        </Link>
        <div className="font-mono text-xs text-ink-500">{row.original.id}</div>
      </div>
    ),
  }),
  column.accessor('kind', { header: 'Kind', enableSorting: false, cell: (info) => <span className="whitespace-nowrap">{kindLabel[info.getValue()]}</span> }),
  column.accessor((row) => row.dut.lot ?? '', {
    id: 'lot',
    header: 'Lot',
    enableSorting: false,
    cell: (info) => <span className="font-mono text-xs">{info.getValue() || '—'}</span>,
  }),
  column.accessor('tags', {
    header: 'Tags',
    enableSorting: false,
    cell: (info) => (
      <div className="flex flex-wrap gap-1">
        {info.getValue().map((tag) => (
          <Badge key={tag}>{tag}</Badge>
        ))}
      </div>
    ),
  }),
  column.accessor('status', { header: 'Status', enableSorting: false, cell: ({ row }) => <StatusBadge status={row.original.status} progress={row.original.progress} /> }),
  column.accessor('verdict', {
    header: 'Verdict',
    cell: ({ row }) => <VerdictBadge verdict={row.original.verdict} />,
  }),
  column.accessor('worstMarginDb', {
    header: 'Margin',
    cell: (info) => {
      const marginDb = info.getValue();
      if (marginDb === null) return <span className="text-xs text-ink-500">—</span>;
      return (
        <span className={marginDb < 0 ? 'tabular font-semibold text-danger-700' : 'tabular'} title="Smallest distance to the mask limits">
          {formatMarginDb(marginDb)}
        </span>
      );
    },
  }),
  column.accessor('createdAt', {
    header: 'Created',
    cell: (info) => (
      <time dateTime={info.getValue()} title={formatDateTime(info.getValue())} className="text-xs whitespace-nowrap">
        {formatRelativeTime(info.getValue())}
      </time>
    ),
  }),
];
