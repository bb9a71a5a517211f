/**
 * Plot colours that stay distinguishable with the common colour-vision deficiencies.
 * `okabeIto`: the eight-colour set of Okabe & Ito, "Color Universal Design" (2002), without black and yellow
 * (yellow is too light on the console's paper background).
 * `tolMuted`: Paul Tol's "muted" qualitative scheme (SRON technical note, "Colour schemes", 2021), nine colours,
 * for overlays of many curves; past nine, curves also differ by dash pattern.
 */
export const okabeIto = {
  blue: '#0072B2',
  vermillion: '#D55E00',
  bluishGreen: '#009E73',
  reddishPurple: '#CC79A7',
  orange: '#E69F00',
  skyBlue: '#56B4E9',
} as const;

export const tolMuted = ['#332288', '#CC6677', '#117733', '#88CCEE', '#882255', '#44AA99', '#999933', '#AA4499', '#DDCC77'] as const;

const OVERLAY_DASHES: (number[] | undefined)[] = [undefined, [6, 3], [2, 3]];

/** Colour and dash of the n-th overlaid curve (0-based). */
export function overlayStyle(index: number): { colour: string; dash?: number[] } {
  return { colour: tolMuted[index % tolMuted.length], dash: OVERLAY_DASHES[Math.floor(index / tolMuted.length) % OVERLAY_DASHES.length] };
}

/** Fills for marked regions and mask bands (translucent, so the grid and curves stay visible). */
export const chartFills = {
  maskBand: 'rgba(0, 158, 115, 0.10)',
  maskLine: '#009E73',
  failingRegion: 'rgba(213, 94, 0, 0.16)',
  failingEdge: '#D55E00',
  gate: 'rgba(86, 180, 233, 0.16)',
  gateEdge: '#0072B2',
  invalidRegion: 'rgba(66, 85, 122, 0.08)',
} as const;

/** Axis and grid colours from the console's ink scale (styles/index.css); canvas needs literal values. */
export const chartInk = {
  axisText: '#42557a',
  axisLabel: '#16253f',
  gridFine: 'rgba(122, 138, 168, 0.22)',
  gridDecade: 'rgba(66, 85, 122, 0.55)',
  zeroLine: 'rgba(22, 37, 63, 0.6)',
} as const;
