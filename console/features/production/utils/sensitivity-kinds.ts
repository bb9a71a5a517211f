import type { ProductionSummary, ProductionUnit } from '@shared/schemas/production';

export type SensitivityKind = keyof ProductionSummary['sensitivity'];

/** Axis words with the unit and the reference each sensitivity figure is stated against. */
export const sensitivityAxisLabel: Record<SensitivityKind, string> = {
  dbSplAt2p83VoltsOneMetre: 'Sensitivity (dB SPL re 20 µPa, 2.83 V RMS at 1 m)',
  dbSplPerVolt: 'Sensitivity (dB SPL re 20 µPa, 1 V RMS)',
  millivoltsPerPascal: 'Sensitivity (mV/Pa)',
};

export const sensitivityUnit: Record<SensitivityKind, string> = {
  dbSplAt2p83VoltsOneMetre: 'dB SPL',
  dbSplPerVolt: 'dB SPL',
  millivoltsPerPascal: 'mV/Pa',
};

const KINDS: SensitivityKind[] = ['dbSplAt2p83VoltsOneMetre', 'dbSplPerVolt', 'millivoltsPerPascal'];

/** The sensitivity the model's results state (loudspeaker, headphone or microphone), or null when none does. */
export function sensitivityKindOf(summary: ProductionSummary): SensitivityKind | null {
  return KINDS.find((kind) => summary.sensitivity[kind] !== null) ?? null;
}

export const sensitivityReader = (kind: SensitivityKind | null) => (unit: ProductionUnit) => (kind ? unit.sensitivity[kind] : null);

export const THD_AXIS_LABEL = 'THD_F at 1 kHz (% of the fundamental)';
