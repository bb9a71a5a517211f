import { cn } from '@console/utils/cn';

export type LegendItem = {
  id: string;
  label: string;
  colour: string;
  dash?: number[];
  markers?: 'none' | 'filled' | 'hollow';
  /** A filled swatch (bands, regions) instead of a line. */
  fill?: boolean;
  visible?: boolean;
};

function Swatch({ item }: { item: LegendItem }) {
  if (item.fill) return <span aria-hidden="true" className="inline-block h-3 w-6 rounded-sm border" style={{ background: item.colour, borderColor: item.colour }} />;
  return (
    <svg aria-hidden="true" viewBox="0 0 24 10" className="h-2.5 w-6 shrink-0">
      <line x1="0" y1="5" x2="24" y2="5" stroke={item.colour} strokeWidth="2" strokeDasharray={item.dash?.join(' ')} />
      {item.markers && item.markers !== 'none' && (
        <circle cx="12" cy="5" r="3" fill={item.markers === 'hollow' ? '#fffefb' : item.colour} stroke={item.colour} strokeWidth="1.5" />
      )}
    </svg>
  );
}

type ChartLegendProps = {
  items: LegendItem[];
  /** With a handler, each entry is a checkbox that shows or hides its curve. */
  onToggle?: (id: string, visible: boolean) => void;
  className?: string;
};

/** The plot's legend in the page (not on the canvas), so it wraps, reads aloud and can toggle curves. */
export function ChartLegend({ items, onToggle, className }: ChartLegendProps) {
  return (
    <ul className={cn('flex flex-wrap gap-x-4 gap-y-1.5 text-xs text-ink-700', className)} aria-label="Legend">
      {items.map((item) => (
        <li key={item.id} className="flex items-center gap-1.5">
          {onToggle ? (
            <label className={cn('flex cursor-pointer items-center gap-1.5', item.visible === false && 'text-ink-400')}>
              <input
                type="checkbox"
                className="size-3.5 accent-ink-700"
                checked={item.visible !== false}
                onChange={(event) => onToggle(item.id, event.target.checked)}
              />
              <Swatch item={item} />
              <span>{item.label}</span>
            </label>
          ) : (
            <>
              <Swatch item={item} />
              <span>{item.label}</span>
            </>
          )}
        </li>
      ))}
    </ul>
  );
}
