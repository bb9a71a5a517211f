import { SweeplineMark } from '@console/components/brand/wordmark';

/** Shown while the first screen's code and data arrive. */
export function AppLoading() {
  return (
    <div role="status" className="flex min-h-screen flex-col items-center justify-center gap-3 text-sm text-ink-600">
      <SweeplineMark className="size-10 animate-pulse" />
      <span>Loading Sweepline…</span>
    </div>
  );
}
