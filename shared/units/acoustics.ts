/**
 * Speed of sound in dry air.
 *
 * We use the ideal-gas form c = 331.3·√(1 + θ/273.15) m/s (θ in °C), which follows from c ∝ √T; the often-quoted
 * linear form 331.3 + 0.606·θ is its first-order Taylor expansion about 0 °C (slope 331.3/(2·273.15) = 0.6065)
 * and overstates c by 0.2 m/s at 20 °C and 0.8 m/s (0.23 %) at 40 °C, which matters for delay-to-distance figures.
 * Humidity raises c by up to ~0.5 % and is ignored (common practice, no source).
 */

/** Speed of sound at 0 °C in dry air, m/s (common practice, no source). */
export const SPEED_OF_SOUND_AT_ZERO_CELSIUS_M_PER_S = 331.3;

/** Speed of sound in dry air, m/s, ideal-gas form 331.3·√(1 + θ/273.15), θ in °C. */
export function speedOfSoundMetresPerSecond(temperatureC: number): number {
  return SPEED_OF_SOUND_AT_ZERO_CELSIUS_M_PER_S * Math.sqrt(1 + temperatureC / 273.15);
}

/** Linear approximation of the speed of sound, 331.3 + 0.606·θ m/s, θ in °C (first-order form of the √ law). */
export function speedOfSoundLinearMetresPerSecond(temperatureC: number): number {
  return SPEED_OF_SOUND_AT_ZERO_CELSIUS_M_PER_S + 0.606 * temperatureC;
}

/** Distance sound travels in `delaySeconds`, metres, at the stated speed of sound (m/s). */
export function distanceMetresFromDelay(delaySeconds: number, speedOfSoundMPerS: number): number {
  return delaySeconds * speedOfSoundMPerS;
}
