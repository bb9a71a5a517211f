import { describe, expect, it } from 'vitest';
import { checkMaskRows, rowsFromPoints, type MaskRow } from './mask-rows';

const row = (id: string, frequencyHz: string, lowerDb: string, upperDb: string): MaskRow => ({ id, frequencyHz, lowerDb, upperDb });

// The rules are the API's own contract for a limit line (shared/schemas/masks.ts: at least 2 points, frequencies
// strictly ascending, levels within ±400 dB) plus the console's audio band 20 Hz–20 kHz and lower below upper.
describe('mask points check', () => {
  it('turns valid rows into upper and lower limit lines on the same frequencies', () => {
    expect(checkMaskRows([row('a', '100', '-3', '3'), row('b', '1e3', '−2.5', '2.5'), row('c', '20000', '-6', '4')])).toEqual({
      ok: true,
      upper: [
        { frequencyHz: 100, levelDb: 3 },
        { frequencyHz: 1000, levelDb: 2.5 },
        { frequencyHz: 20000, levelDb: 4 },
      ],
      lower: [
        { frequencyHz: 100, levelDb: -3 },
        { frequencyHz: 1000, levelDb: -2.5 },
        { frequencyHz: 20000, levelDb: -6 },
      ],
    });
  });

  it('says per cell what is wrong', () => {
    const result = checkMaskRows([
      row('a', '1000', '-3', '3'),
      row('b', '500', '-3', '3'), // not ascending
      row('c', '19.9', '-3', '3'), // below 20 Hz
      row('d', '2 kHz', 'x', ''), // text, not numbers; empty
      row('e', '4000', '3', '-3'), // lower above upper
      row('f', '8000', '-3', '3'),
      row('g', '9000', '-401', '3'), // beyond the API's ±400 dB
      row('h', '9000', '-1', '1'), // equal to the row before
    ]);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.formError).toBeNull();
    expect(result.cellErrors).toEqual({
      b: { frequencyHz: 'Must be above the row before (1 kHz).' },
      c: { frequencyHz: 'Use 20 Hz to 20 kHz.' },
      d: { frequencyHz: 'Numbers only.', lowerDb: 'Numbers only.', upperDb: 'Required.' },
      e: { upperDb: 'Must be above the lower limit.' },
      g: { lowerDb: 'Use −400 to 400 dB.' },
      h: { frequencyHz: 'Must be above the row before (9 kHz).' },
    });
  });

  it('needs at least two points', () => {
    expect(checkMaskRows([row('a', '1000', '-3', '3')])).toEqual({ ok: false, cellErrors: {}, formError: 'Give at least 2 points.' });
    expect(checkMaskRows([])).toMatchObject({ ok: false, formError: 'Give at least 2 points.' });
  });

  it('reads a stored version back into rows', () => {
    const rows = rowsFromPoints([{ frequencyHz: 100, levelDb: 3 }, { frequencyHz: 5000, levelDb: 2 }], [{ frequencyHz: 100, levelDb: -3 }]);
    expect(rows.map(({ frequencyHz, lowerDb, upperDb }) => [frequencyHz, lowerDb, upperDb])).toEqual([
      ['100', '-3', '3'],
      ['5000', '', '2'],
    ]);
  });
});
