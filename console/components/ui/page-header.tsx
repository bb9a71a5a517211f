import type { ReactNode } from 'react';

type PageHeaderProps = { eyebrow?: string; title: string; description?: ReactNode; actions?: ReactNode };

/** The page's one h1, with the section it belongs to above it; also sets the document title. */
export function PageHeader({ eyebrow, title, description, actions }: PageHeaderProps) {
  return (
    <header className="flex flex-wrap items-end justify-between gap-4 pb-6">
      <title>{`${title} · Sweepline`}</title>
      <div className="space-y-1.5">
        {eyebrow && <p className="font-mono text-eyebrow font-semibold text-signal-800 uppercase">{eyebrow}</p>}
        <h1 className="text-2xl font-extrabold tracking-tight text-ink-900">{title}</h1>
        {description && <p className="max-w-2xl text-sm text-ink-600">{description}</p>}
      </div>
      {actions && <div className="flex items-center gap-2">{actions}</div>}
    </header>
  );
}
