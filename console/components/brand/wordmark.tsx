import { cn } from '@console/utils/cn';

// The mark is an exponential sweep drawn as a trace: slow cycles on the left, fast on the right.
const MARK_SIZE = 32;
const chirpPath = (() => {
  const startX = 4;
  const endX = 28;
  const cycles = { start: 0.75, ratio: 11 };
  const steps = 160;
  const points: string[] = [];
  for (let step = 0; step <= steps; step += 1) {
    const t = step / steps;
    const rate = Math.log(cycles.ratio);
    const phase = (2 * Math.PI * cycles.start * (Math.exp(rate * t) - 1)) / rate;
    const envelope = 7.5 * (1 - 0.35 * t);
    const x = startX + (endX - startX) * t;
    const y = MARK_SIZE / 2 - envelope * Math.sin(phase);
    points.push(`${step === 0 ? 'M' : 'L'}${x.toFixed(2)} ${y.toFixed(2)}`);
  }
  return points.join(' ');
})();

export function SweeplineMark({ className }: { className?: string }) {
  return (
    <svg viewBox={`0 0 ${MARK_SIZE} ${MARK_SIZE}`} aria-hidden="true" className={cn('size-8 shrink-0', className)}>
      <rect x="0.5" y="0.5" width="31" height="31" rx="7" className="fill-ink-800 stroke-ink-600" />
      <line x1="4" y1="16" x2="28" y2="16" className="stroke-ink-600" strokeWidth="0.75" />
      <path d={chirpPath} fill="none" className="stroke-signal-400" strokeWidth="1.5" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}

/** Mark plus name; `tone` picks the lettering colour for dark or light ground. */
export function Wordmark({ tone = 'light', className }: { tone?: 'light' | 'dark'; className?: string }) {
  return (
    <span className={cn('inline-flex items-center gap-2.5', className)}>
      <SweeplineMark />
      <span className={cn('text-lg leading-none tracking-tight', tone === 'light' ? 'text-white' : 'text-ink-900')}>
        <span className="font-extrabold">Sweep</span>
        <span className="font-medium">line</span>
      </span>
    </span>
  );
}
