import type { ReactNode } from 'react';
import { cn } from '@console/utils/cn';

type PanelProps = {
  title?: ReactNode;
  description?: ReactNode;
  actions?: ReactNode;
  children: ReactNode;
  className?: string;
  /** Tables run edge to edge; forms and text get padding. */
  flush?: boolean;
  headingLevel?: 'h2' | 'h3';
  id?: string;
};

export function Panel({ title, description, actions, children, className, flush, headingLevel = 'h2', id }: PanelProps) {
  const Heading = headingLevel;
  const headingId = id ? `${id}-title` : undefined;
  return (
    <section
      id={id}
      aria-labelledby={headingId}
      className={cn('rounded-lg border border-ink-200 bg-surface shadow-panel', className)}
    >
      {(title || actions) && (
        <header className="flex flex-wrap items-start justify-between gap-3 border-b border-ink-100 px-5 py-4">
          <div className="space-y-0.5">
            {title && (
              <Heading id={headingId} className="text-base font-bold text-ink-900">
                {title}
              </Heading>
            )}
            {description && <p className="text-sm text-ink-600">{description}</p>}
          </div>
          {actions && <div className="flex items-center gap-2">{actions}</div>}
        </header>
      )}
      <div className={flush ? undefined : 'px-5 py-5'}>{children}</div>
    </section>
  );
}
