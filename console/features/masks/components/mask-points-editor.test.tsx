import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { checkMaskRows, type MaskRow } from '../utils/mask-rows';
import { MaskPointsEditor } from './mask-points-editor';

const rows: MaskRow[] = [
  { id: 'r1', frequencyHz: '1000', lowerDb: '-3', upperDb: '3' },
  { id: 'r2', frequencyHz: '500', lowerDb: '-3', upperDb: 'abc' },
];

function render(editorRows: MaskRow[]) {
  const check = checkMaskRows(editorRows);
  const html = renderToStaticMarkup(
    <MaskPointsEditor rows={editorRows} onChange={() => {}} cellErrors={check.ok ? {} : check.cellErrors} formError={check.ok ? null : check.formError} />,
  );
  return new DOMParserLite(html);
}

const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Just enough of a DOM query over static markup for these checks (the unit tests run without a browser DOM). */
class DOMParserLite {
  constructor(readonly html: string) {}
  input(label: string): string {
    const match = new RegExp(`<input[^>]*aria-label="${escape(label)}"[^>]*>`).exec(this.html);
    if (!match) throw new Error(`no input labelled ${label}`);
    return match[0];
  }
  text(id: string): string | null {
    return new RegExp(`<p id="${escape(id)}"[^>]*>([^<]*)</p>`).exec(this.html)?.[1] ?? null;
  }
}

const describedBy = (input: string) => /aria-describedby="([^"]+)"/.exec(input)?.[1] ?? null;

describe('mask points editor', () => {
  it('shows each message under its own cell and ties it to the input', () => {
    const page = render(rows);
    const frequency = page.input('Row 2 Frequency (Hz)');
    expect(frequency).toContain('aria-invalid="true"');
    expect(page.text(describedBy(frequency)!)).toBe('Must be above the row before (1 kHz).');
    const upper = page.input('Row 2 Upper limit (dB)');
    expect(page.text(describedBy(upper)!)).toBe('Numbers only.');
    // The valid cells carry no message and are not marked invalid.
    const lower = page.input('Row 2 Lower limit (dB)');
    expect(lower).not.toContain('aria-invalid');
    expect(describedBy(lower)).toBeNull();
    expect(page.input('Row 1 Frequency (Hz)')).not.toContain('aria-invalid');
  });

  it('shows the whole-table message when there are too few points', () => {
    const page = render([rows[0]]);
    expect(page.html).toContain('role="alert"');
    expect(page.html).toContain('Give at least 2 points.');
    expect(page.html).toContain('aria-label="Remove row 1"');
  });
});
