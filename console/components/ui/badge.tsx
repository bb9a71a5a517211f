import type { ReactNode } from 'react';
import { cn } from '@console/utils/cn';

export type BadgeTone = 'neutral' | 'ok' | 'warning' | 'danger' | 'accent';

const toneClasses: Record<BadgeTone, string> = {
  neutral: 'bg-ink-100 text-ink-700 border-ink-200',
  ok: 'bg-ok-50 text-ok-700 border-ok-600/40',
  warning: 'bg-signal-50 text-signal-800 border-signal-600/40',
  danger: 'bg-danger-50 text-danger-700 border-danger-600/40',
  accent: 'bg-ink-800 text-signal-300 border-ink-800',
};

/** Status words always carry the meaning; the colour only repeats it. */
export function Badge({ tone = 'neutral', children, className }: { tone?: BadgeTone; children: ReactNode; className?: string }) {
  return (
    <span
      className={cn(
        'inline-flex items-center gap-1 rounded-sm border px-1.5 py-0.5 text-xs font-semibold whitespace-nowrap',
        toneClasses[tone],
        className,
      )}
    >
      {children}
    </span>
  );
}
