/**
 * Plain-language safety notes attached to every stimulus description, so whoever plays it sees them beside the
 * file. They are cautions, not a procedure: the lab's own procedures and local regulations take precedence.
 */
export const STIMULUS_CAUTIONS: readonly string[] = [
  'Hearing: test signals at measurement levels can exceed 100–120 dB SPL at a headphone or close to a driver. Never play them into headphones worn by a person; use an ear simulator or coupler.',
  'Start at a low level and raise it step by step; protect anyone near an open rig.',
  'Driver damage: a full-scale sweep puts as much amplitude into the high-frequency part as into the low one and can burn tweeters or over-excurse woofers near and below resonance. Set a drive-voltage limit for each device under test and check it at the terminals.',
  'Keep the fades: start and stop clicks and DC offsets stress drivers.',
  'Absolute levels are only as good as the calibration and the gain settings at the time of the capture.',
  "These notes do not replace the lab's own procedures, the device maker's ratings or local regulations on noise exposure; follow those first.",
];

export function stimulusCautions(): string[] {
  return [...STIMULUS_CAUTIONS];
}
