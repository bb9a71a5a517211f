import { Panel } from '@console/components/ui/panel';
import { cn } from '@console/utils/cn';
import { formatDateTime } from '@console/utils/format-date';
import type { Analysis } from '@shared/schemas/analyses';
import { figureGroups, type FigureRow } from '../utils/figure-rows';
import type { ResultEnvelope } from '../utils/result-view';

const toneClass = { danger: 'text-danger-700 font-bold', warning: 'text-signal-800' } as const;

function Rows({ rows }: { rows: FigureRow[] }) {
  return (
    <dl className="grid grid-cols-[minmax(6.5rem,42%)_minmax(0,1fr)] gap-x-3 gap-y-1.5 text-sm">
      {rows.map((row, i) => (
        <div key={`${row.label}-${i}`} className="contents">
          <dt className="text-ink-600">{row.label}</dt>
          <dd className={cn('text-right font-mono text-xs leading-5 text-ink-900 tabular [overflow-wrap:anywhere]', row.tone && toneClass[row.tone])}>
            {row.value}
            {row.note && <div className="font-sans text-xs font-normal text-ink-500">{row.note}</div>}
          </dd>
        </div>
      ))}
    </dl>
  );
}

const CONDITION_LABELS: Record<string, [string, string]> = {
  distanceM: ['Distance', 'm'],
  driveVoltageVrms: ['Drive', 'V RMS'],
  nominalImpedanceOhm: ['Nominal impedance', 'Ω'],
  temperatureC: ['Temperature', '°C'],
  environment: ['Environment', ''],
  fixture: ['Fixture', ''],
};

function conditionRows(analysis: Analysis): FigureRow[] {
  const conditions = (analysis.request.conditions ?? {}) as Record<string, unknown>;
  const rows: FigureRow[] = Object.entries(CONDITION_LABELS).flatMap(([key, [label, unit]]) =>
    conditions[key] === undefined ? [] : [{ label, value: `${String(conditions[key]).replace('_', ' ')}${unit ? ` ${unit}` : ''}` }],
  );
  const gate = conditions.gate as { lengthSeconds?: number } | undefined;
  if (gate?.lengthSeconds !== undefined) rows.push({ label: 'Gate', value: `${Number((gate.lengthSeconds * 1000).toPrecision(4))} ms after the peak` });
  return rows;
}

function calibrationRows(analysis: Analysis): FigureRow[] {
  const calibration = analysis.calibration;
  if (!calibration) return [{ label: 'Calibration', value: 'none — levels are relative', tone: 'warning' }];
  return [
    { label: 'Calibration', value: calibration.id, note: calibration.source },
    { label: '1 Pa reads', value: `${calibration.dbfsAtOnePascal.toFixed(2)} dBFS` },
    {
      label: 'Valid until',
      value: calibration.validUntil ? formatDateTime(calibration.validUntil) : 'no end date',
      tone: calibration.expired ? 'danger' : undefined,
      note: calibration.expired ? 'expired when the analysis ran' : undefined,
    },
  ];
}

/** Everything the result states as single numbers, with the calibration, conditions and engine behind them. */
export function FiguresPanel({ analysis, result }: { analysis: Analysis; result: ResultEnvelope }) {
  const groups = [
    ...figureGroups(result),
    { title: 'Calibration', rows: calibrationRows(analysis) },
    { title: 'Conditions', rows: conditionRows(analysis) },
    { title: 'Engine', rows: [{ label: 'Version', value: result.engineVersion || analysis.engineVersion || '—' }] },
  ].filter((group) => group.rows.length > 0);
  return (
    <Panel title="Figures" headingLevel="h2">
      <div className="space-y-5">
        {groups.map((group) => (
          <section key={group.title} aria-label={group.title} className="space-y-2">
            <h3 className="font-mono text-eyebrow font-semibold text-ink-500 uppercase">{group.title}</h3>
            <Rows rows={group.rows} />
          </section>
        ))}
      </div>
    </Panel>
  );
}
