import { useEffect, useRef, type RefObject } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { AlignedData, ChartSpec } from './chart-spec';
import { markChart } from './chart-timing';
import { buildUplotOptions, CHART_CANVAS_FONTS, CHART_FONTS } from './uplot-options';

type UplotHandlers = {
  /** Milliseconds from creating the chart to the end of its first draw (for the console benchmark). */
  onFirstDraw?: (durationMs: number) => void;
  onCursor?: (index: number | null) => void;
};

let chartFonts: Promise<void> | null = null;

/**
 * Resolves once the chart fonts are loaded and the canvas has drawn text with them once. The canvas measures
 * text when a chart is created; with the fonts still loading it would lay out the axes with a fallback font and
 * never correct them. The first text a canvas draws in a newly loaded variable font also costs several
 * milliseconds (the face is set up for the canvas), which is paid here, once per page, instead of inside
 * every first chart.
 */
export function chartFontsReady(): Promise<void> {
  chartFonts ??= (async () => {
    if (typeof document === 'undefined' || !document.fonts) return;
    await Promise.all(CHART_FONTS.map((font) => document.fonts.load(font).catch(() => [])));
    const context = document.createElement('canvas').getContext('2d');
    if (!context) return;
    for (const font of CHART_CANVAS_FONTS) {
      context.font = font;
      context.fillText('0123456789 kHz dB −+.()', 0, 12);
    }
  })();
  return chartFonts;
}

// The chart module loads with the screen that shows a chart, usually while its data is still being fetched:
// start the fonts then, not when the data has arrived.
void chartFontsReady();

/** Creates a uPlot chart in `container` for `spec`, keeps it as wide as the container, and destroys it on change. */
export function useUplot(
  container: RefObject<HTMLDivElement | null>,
  spec: ChartSpec,
  data: AlignedData,
  heightPx: number,
  handlers: UplotHandlers = {},
): RefObject<uPlot | null> {
  const chartRef = useRef<uPlot | null>(null);
  const handlersRef = useRef(handlers);
  handlersRef.current = handlers;

  useEffect(() => {
    const element = container.current;
    if (!element) return;
    let cancelled = false;
    let observer: ResizeObserver | null = null;

    markChart('effect');
    void chartFontsReady().then(() => {
      if (cancelled) return;
      markChart('fonts');
      const startedMs = performance.now();
      let drawn = false;
      const options = buildUplotOptions(
        spec,
        { width: Math.max(element.clientWidth, 200), height: heightPx },
        {
          draw: [
            () => {
              if (drawn) return;
              drawn = true;
              markChart('drawn');
              handlersRef.current.onFirstDraw?.(performance.now() - startedMs);
            },
          ],
          setCursor: [(u) => handlersRef.current.onCursor?.(u.cursor.idx ?? null)],
        },
      );
      markChart('create');
      // uPlot walks the series with plain-array access patterns; typed arrays make its first path build slower.
      const columns = [data.x, ...data.ys].map((column) => (ArrayBuffer.isView(column) ? Array.from(column as ArrayLike<number>) : column));
      const chart = new uPlot(options, columns as uPlot.AlignedData, element);
      chartRef.current = chart;
      observer = new ResizeObserver(() => {
        const width = Math.max(element.clientWidth, 200);
        if (width !== chart.width) chart.setSize({ width, height: heightPx });
      });
      observer.observe(element);
    });

    return () => {
      cancelled = true;
      observer?.disconnect();
      chartRef.current?.destroy();
      chartRef.current = null;
    };
  }, [container, spec, data, heightPx]);

  return chartRef;
}
