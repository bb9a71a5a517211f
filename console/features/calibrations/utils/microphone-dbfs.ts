/**
 * Chain sensitivity from a microphone's sensitivity and the converter's full scale: a 1 Pa tone gives M volts,
 * and full scale is the RMS voltage of a sine that just reaches it, so dBFS at 1 Pa = 20·log10(M / V_FS,rms)
 * (AES17: a full-scale sine reads 0 dBFS). The same formula the API applies; shown as a preview only.
 */
export function dbfsAtOnePascalFromMicrophone(millivoltsPerPascal: number, fullScaleVoltsRms: number): number {
  return 20 * Math.log10(millivoltsPerPascal / 1000 / fullScaleVoltsRms);
}

/** A sine's RMS is its peak over √2, so a converter rated by peak volts has V_FS,rms = V_peak / √2. */
export const fullScaleRmsFromPeak = (fullScaleVoltsPeak: number) => fullScaleVoltsPeak / Math.SQRT2;
