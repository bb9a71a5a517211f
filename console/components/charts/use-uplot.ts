import { useEffect, useRef, type RefObject } from 'react';
import uPlot from 'uplot';
import 'uplot/dist/uPlot.min.css';
import type { AlignedData, ChartSpec } from './chart-spec';
import { buildUplotOptions, CHART_FONTS } from './uplot-options';

type UplotHandlers = {
  /** Milliseconds from creating the chart to the end of its first draw (for the console benchmark). */
  onFirstDraw?: (durationMs: number) => void;
  onCursor?: (index: number | null) => void;
};

async function fontsReady(): Promise<void> {
  // The canvas measures text when the chart is created; with the fonts still loading it would lay out the axes
  // with a fallback font and never correct them.
  if (typeof document === 'undefined' || !document.fonts) return;
  await Promise.all(CHART_FONTS.map((font) => document.fonts.load(font).catch(() => [])));
}

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

    void fontsReady().then(() => {
      if (cancelled) return;
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
              handlersRef.current.onFirstDraw?.(performance.now() - startedMs);
            },
          ],
          setCursor: [(u) => handlersRef.current.onCursor?.(u.cursor.idx ?? null)],
        },
      );
      const chart = new uPlot(options, [data.x, ...data.ys] as uPlot.AlignedData, element);
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
