import type { OverlayCurve } from './overlay';

/**
 * Deterministic stand-in responses for the overlay benchmark: a second-order high-pass roll-off, a gentle tilt
 * and a ripple that differ per curve, on a log grid from 20 Hz to 20 kHz.
 */
export function syntheticCurves(curveCount: number, pointCount: number): OverlayCurve[] {
  const frequencyHz = Array.from({ length: pointCount }, (_, i) => 20 * 1000 ** (i / (pointCount - 1)));
  return Array.from({ length: curveCount }, (_, c) => {
    const cornerHz = 45 + 4 * c;
    const magnitudeDb = frequencyHz.map((f) => {
      const ratio = (f / cornerHz) ** 2;
      const highPassDb = 10 * Math.log10(ratio ** 2 / ((1 - ratio) ** 2 + ratio * 2));
      return 86 + 0.2 * c + highPassDb - 0.8 * Math.log2(f / 1000) * (c % 3 === 0 ? 1 : 0.5) + 0.6 * Math.sin(Math.log2(f) * (3 + c * 0.3));
    });
    return { id: `synthetic-${c + 1}`, label: `Unit ${c + 1}`, frequencyHz, magnitudeDb };
  });
}
