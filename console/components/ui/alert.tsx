import type { ReactNode } from 'react';
import { describeProblem } from '@console/lib/problem-message';
import { cn } from '@console/utils/cn';

export type AlertTone = 'danger' | 'warning' | 'info' | 'success';

const toneClasses: Record<AlertTone, string> = {
  danger: 'border-danger-600 bg-danger-50 text-danger-700',
  warning: 'border-signal-600 bg-signal-50 text-signal-800',
  info: 'border-ink-300 bg-ink-50 text-ink-700',
  success: 'border-ok-600 bg-ok-50 text-ok-700',
};

const toneMarks: Record<AlertTone, string> = { danger: '!', warning: '!', info: 'i', success: '✓' };

type AlertProps = { tone: AlertTone; title: ReactNode; children?: ReactNode; className?: string; role?: 'alert' | 'status' };

export function Alert({ tone, title, children, className, role }: AlertProps) {
  return (
    <div role={role} className={cn('flex gap-3 rounded-md border-l-4 border px-4 py-3 text-sm', toneClasses[tone], className)}>
      <span
        aria-hidden="true"
        className="mt-0.5 flex size-5 shrink-0 items-center justify-center rounded-full border border-current text-xs font-bold"
      >
        {toneMarks[tone]}
      </span>
      <div className="min-w-0 space-y-1">
        <p className="font-bold">{title}</p>
        {children && <div className="text-ink-800">{children}</div>}
      </div>
    </div>
  );
}

/** Shows a failed request: the problem's detail, a next step where known, and the request id for support. */
export function ProblemAlert({ error, className }: { error: unknown; className?: string }) {
  const message = describeProblem(error);
  return (
    <Alert tone="danger" title={message.title} className={className} role="alert">
      {message.detail && <p>{message.detail}</p>}
      {message.hint && <p>{message.hint}</p>}
      {message.requestId && (
        <p className="text-xs text-ink-600">
          Request id <span className="font-mono">{message.requestId}</span>
        </p>
      )}
    </Alert>
  );
}
