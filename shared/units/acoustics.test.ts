import { describe, expect, it } from 'vitest';
import { distanceMetresFromDelay, speedOfSoundLinearMetresPerSecond, speedOfSoundMetresPerSecond } from './acoustics';

describe('speed of sound in dry air', () => {
  it('is 331.3 m/s at 0 °C and follows c ∝ √T (ideal gas, T = θ + 273.15 K)', () => {
    expect(speedOfSoundMetresPerSecond(0)).toBe(331.3);
    // Ratio of speeds at two temperatures is √(T2/T1) (ideal-gas law, closed form).
    expect(speedOfSoundMetresPerSecond(40) / speedOfSoundMetresPerSecond(-10)).toBeCloseTo(Math.sqrt(313.15 / 263.15), 12);
    expect(speedOfSoundMetresPerSecond(20)).toBeCloseTo(343.2, 1);
  });

  it('has the linear form 331.3 + 0.606·θ as its tangent at 0 °C (slope 331.3/(2·273.15)), which overstates c away from 0 °C', () => {
    const slope = (speedOfSoundMetresPerSecond(0.001) - speedOfSoundMetresPerSecond(-0.001)) / 0.002;
    expect(slope).toBeCloseTo(331.3 / (2 * 273.15), 6);
    expect(slope).toBeCloseTo(0.606, 3);
    for (let theta = -10; theta <= 40; theta += 5) {
      const excess = speedOfSoundLinearMetresPerSecond(theta) - speedOfSoundMetresPerSecond(theta);
      expect(excess).toBeGreaterThanOrEqual(0);
      expect(excess).toBeLessThan(0.85);
    }
    expect(speedOfSoundLinearMetresPerSecond(20)).toBeCloseTo(343.42, 2);
  });

  it('turns a delay into a distance at the stated speed', () => {
    expect(distanceMetresFromDelay(0.01, 343)).toBeCloseTo(3.43, 12);
  });
});
