import { describe, expect, it } from 'vitest';
import { combineExports, exportFileName } from './bulk-export';

// Our own bulk-export format (documented in the function); RFC 4180 §2 allows no comment lines, so the `#` lines
// follow the single export's own convention (common practice, no source).
describe('bulk export', () => {
  const at = new Date('2026-12-01T09:30:00Z');

  it('wraps each stored JSON result unchanged under its id', () => {
    const text = combineExports('json', [{ analysisId: 'ana_1', text: '{"kind":"frequency_response","figures":{"delayMs":2.9}}' }], at);
    expect(JSON.parse(text)).toEqual({ exportedAt: '2026-12-01T09:30:00.000Z', analyses: [{ id: 'ana_1', result: { kind: 'frequency_response', figures: { delayMs: 2.9 } } }] });
  });

  it('concatenates CSV exports, each opened by its id and separated by a blank line', () => {
    const text = combineExports('csv', [{ analysisId: 'ana_1', text: '# a\nf,m\n20,1\n' }, { analysisId: 'ana_2', text: 'f,m\n20,2' }], at);
    expect(text).toBe('# analysis: ana_1\n# a\nf,m\n20,1\n\n# analysis: ana_2\nf,m\n20,2\n');
  });

  it('names the file after the count and the time', () => {
    expect(exportFileName('csv', 3, at)).toBe('sweepline-3-analyses-2026-12-01-09-30-00.csv');
  });
});
