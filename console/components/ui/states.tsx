import type { ReactNode } from 'react';
import { Spinner } from './spinner';
import { ProblemAlert } from './alert';
import { Button } from './button';

/** Loading text lives in a status region so screen readers hear it without moving focus. */
export function LoadingState({ label }: { label: string }) {
  return (
    <div role="status" className="flex items-center gap-2 px-5 py-8 text-sm text-ink-600">
      <Spinner className="text-signal-700" />
      <span>{label}</span>
    </div>
  );
}

export function EmptyState({ title, children }: { title: string; children?: ReactNode }) {
  return (
    <div className="flex flex-col items-center gap-2 px-5 py-10 text-center">
      <svg viewBox="0 0 48 16" aria-hidden="true" className="h-4 w-12 text-ink-300">
        <path d="M0 8h14l3-6 4 12 4-12 3 6h20" fill="none" stroke="currentColor" strokeWidth="1.5" />
      </svg>
      <p className="text-sm font-bold text-ink-800">{title}</p>
      {children && <div className="max-w-md text-sm text-ink-600">{children}</div>}
    </div>
  );
}

export function ErrorState({ error, onRetry }: { error: unknown; onRetry?: () => void }) {
  return (
    <div className="space-y-3 px-5 py-5">
      <ProblemAlert error={error} />
      {onRetry && (
        <Button variant="secondary" size="sm" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}
