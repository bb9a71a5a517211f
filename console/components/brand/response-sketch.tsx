import { cn } from '@console/utils/cn';

// A decorative response curve of an invented two-way speaker on a 20 Hz–20 kHz log axis. It is drawn from a
// second-order high-pass (55 Hz, Q 0.8), a mild presence lift and a gentle top roll-off: illustration, not data.
const WIDTH = 480;
const HEIGHT = 200;
const LOW_HZ = 20;
const HIGH_HZ = 20_000;
const DB_SPAN = 36;

const xOf = (frequencyHz: number) => (Math.log10(frequencyHz / LOW_HZ) / Math.log10(HIGH_HZ / LOW_HZ)) * WIDTH;
const yOf = (levelDb: number) => HEIGHT * 0.42 - (levelDb / DB_SPAN) * HEIGHT;

function sketchLevelDb(frequencyHz: number): number {
  const ratio = frequencyHz / 55;
  const highPass = (ratio * ratio) / Math.hypot(1 - ratio * ratio, ratio / 0.8);
  const lift = 1.6 * Math.exp(-(Math.log2(frequencyHz / 3000) ** 2) / 0.8);
  const topRollOff = 1 / Math.sqrt(1 + (frequencyHz / 16_000) ** 4);
  const ripple = 0.6 * Math.sin(Math.log(frequencyHz) * 4.2);
  return 20 * Math.log10(highPass * topRollOff) + lift + ripple;
}

const curvePath = (() => {
  const steps = 160;
  const points: string[] = [];
  for (let step = 0; step <= steps; step += 1) {
    const frequencyHz = LOW_HZ * (HIGH_HZ / LOW_HZ) ** (step / steps);
    points.push(`${step === 0 ? 'M' : 'L'}${xOf(frequencyHz).toFixed(1)} ${yOf(sketchLevelDb(frequencyHz)).toFixed(1)}`);
  }
  return points.join(' ');
})();

const decades = [100, 1000, 10_000];
const minorLines = [20, 100, 1000, 10_000].flatMap((decade) =>
  [2, 3, 4, 5, 6, 7, 8, 9].map((step) => (decade === 20 ? 10 * step : decade * step)).filter((f) => f > LOW_HZ && f < HIGH_HZ),
);
const axisLabels: Array<[number, string]> = [
  [20, '20 Hz'],
  [100, '100'],
  [1000, '1k'],
  [10_000, '10k'],
  [20_000, '20k'],
];

export function ResponseSketch({ className }: { className?: string }) {
  return (
    <svg viewBox={`-4 -4 ${WIDTH + 8} ${HEIGHT + 28}`} aria-hidden="true" className={cn('h-auto', className)}>
      {minorLines.map((frequencyHz) => (
        <line key={frequencyHz} x1={xOf(frequencyHz)} x2={xOf(frequencyHz)} y1="0" y2={HEIGHT} stroke="currentColor" strokeWidth="0.5" />
      ))}
      {decades.map((frequencyHz) => (
        <line key={frequencyHz} x1={xOf(frequencyHz)} x2={xOf(frequencyHz)} y1="0" y2={HEIGHT} className="stroke-ink-600" strokeWidth="1" />
      ))}
      {[0, 0.25, 0.5, 0.75, 1].map((fraction) => (
        <line key={fraction} x1="0" x2={WIDTH} y1={HEIGHT * fraction} y2={HEIGHT * fraction} stroke="currentColor" strokeWidth="0.5" />
      ))}
      <path d={curvePath} fill="none" className="stroke-signal-400" strokeWidth="2.25" strokeLinejoin="round" />
      {axisLabels.map(([frequencyHz, label]) => (
        <text
          key={label}
          x={xOf(frequencyHz)}
          y={HEIGHT + 18}
          textAnchor={frequencyHz === LOW_HZ ? 'start' : frequencyHz === HIGH_HZ ? 'end' : 'middle'}
          className="fill-ink-400 font-mono text-[11px]"
        >
          {label}
        </text>
      ))}
    </svg>
  );
}
