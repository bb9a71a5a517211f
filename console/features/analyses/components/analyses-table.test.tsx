import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router';
import type { AnalysisSort } from '@shared/schemas/analyses';
import { getAnalysesQueryOptions, type AnalysisSummary } from '../api/get-analyses';
import { AnalysesTable } from './analyses-table';

function summary(id: string, overrides: Partial<AnalysisSummary>): AnalysisSummary {
  return {
    id,
    kind: 'spectrum',
    status: 'succeeded',
    progress: 1,
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:01.000Z',
    startedAt: '2026-12-01T10:00:00.500Z',
    finishedAt: '2026-12-01T10:00:01.000Z',
    captureId: null,
    stimulusId: null,
    request: {},
    dut: { model: 'KB-65 woofer', serial: null, lot: null },
    tags: [],
    rerunOf: null,
    attempts: 1,
    engineVersion: 'test',
    calibration: null,
    verdict: null,
    worstMarginDb: null,
    warnings: [],
    conventions: null,
    error: null,
    ...overrides,
  };
}

// As the server answered for sort=worstMarginDb: worst first, no mask last. The table must keep this order.
const SERVER_ORDER = [
  summary('ana_00000000000000000003', { verdict: 'fail', worstMarginDb: -1.04, dut: { model: 'KB-65 woofer', serial: 'KB65-24-000124', lot: null } }),
  summary('ana_00000000000000000001', { verdict: 'pass', worstMarginDb: 3, dut: { model: 'KB-T25 tweeter', serial: null, lot: null } }),
  summary('ana_00000000000000000002', { verdict: null, worstMarginDb: null, dut: { model: 'KB-H40 headphone', serial: null, lot: null } }),
];

function render(sort: AnalysisSort, rows: AnalysisSummary[]) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
  queryClient.setQueryData(getAnalysesQueryOptions({}, sort).queryKey, { pages: [{ data: rows, hasMore: false }], pageParams: [undefined] });
  return renderToStaticMarkup(
    <QueryClientProvider client={queryClient}>
      <MemoryRouter>
        <AnalysesTable filters={{}} sort={sort} onSortChange={() => {}} selection={{}} onSelectionChange={() => {}} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const headers = (html: string) => [...html.matchAll(/<th([^>]*)>(.*?)<\/th>/g)].map(([, attributes, inner]) => ({ attributes, inner, text: inner.replace(/<[^>]+>/g, '').replace(/[▲▼]/g, '').trim() }));

// WAI-ARIA 1.2 §6.7 aria-sort (ascending | descending on the sorted header only); the APG sortable-table pattern
// puts a button in each sortable header so it is reachable and operable by keyboard.
describe('analyses table header sort', () => {
  it('marks the server sort on its column only, with a button in every sortable header', () => {
    const html = render('worstMarginDb', SERVER_ORDER);
    const th = headers(html);
    const sorted = th.filter((header) => header.attributes.includes('aria-sort'));
    expect(sorted.map((header) => [header.text, header.attributes.match(/aria-sort="(\w+)"/)![1]])).toEqual([['Margin', 'ascending']]);
    const withButton = th.filter((header) => header.inner.includes('<button')).map((header) => header.text);
    expect(withButton).toEqual(['Device', 'Verdict', 'Margin', 'Created']);
    expect(html).toContain('Analyses, by worst margin, ascending');
  });

  it('shows the rows in the order the server sent (no sorting in the browser)', () => {
    const html = render('worstMarginDb', SERVER_ORDER);
    const ids = [...html.matchAll(/>(ana_\d{20})</g)].map((match) => match[1]);
    expect(ids).toEqual(SERVER_ORDER.map((row) => row.id));
    // Margins with their sign; a missing one is a dash.
    expect(html).toContain('−1.0 dB');
    expect(html).toContain('+3.0 dB');
  });

  it('marks newest first on Created by default and descending sorts as descending', () => {
    expect(headers(render('-createdAt', SERVER_ORDER)).find((header) => header.text === 'Created')!.attributes).toContain('aria-sort="descending"');
    expect(headers(render('-model', SERVER_ORDER)).find((header) => header.text === 'Device')!.attributes).toContain('aria-sort="descending"');
  });
});
