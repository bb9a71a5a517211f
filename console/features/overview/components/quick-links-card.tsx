import type { ReactNode } from 'react';
import { Link } from 'react-router';
import { Icon } from '@console/components/ui/icons';
import { Panel } from '@console/components/ui/panel';
import { env } from '@console/config/env';
import { paths } from '@console/config/paths';
import { hasPermission } from '@console/lib/authorization';

type Session = Parameters<typeof hasPermission>[0];

const linkClasses =
  'group flex items-start gap-3 rounded-md border border-ink-200 px-3 py-2.5 hover:border-ink-400 hover:bg-ink-50 focus-visible:outline-2 focus-visible:outline-signal-700';

function Item({ title, children }: { title: string; children: ReactNode }) {
  return (
    <span className="min-w-0">
      <span className="block text-sm font-bold text-ink-900 group-hover:underline">{title}</span>
      <span className="block text-xs text-ink-600">{children}</span>
    </span>
  );
}

/** Where a newcomer goes next; links the role cannot use are left out. */
export function QuickLinksCard({ session }: { session: Session }) {
  const links: { key: string; node: ReactNode }[] = [];
  if (hasPermission(session, 'analyses:read')) {
    links.push({
      key: 'compare',
      node: (
        <Link to={paths.app.analyses.getHref()} className={linkClasses}>
          <Icon name="compare" className="mt-0.5 size-4 shrink-0 text-ink-500" />
          <Item title="Compare responses">Pick up to 10 analyses in the history and overlay their curves.</Item>
        </Link>
      ),
    });
  }
  if (hasPermission(session, 'keys:manage')) {
    links.push({
      key: 'keys',
      node: (
        <Link to={paths.app.apiKeys.getHref()} className={linkClasses}>
          <Icon name="key" className="mt-0.5 size-4 shrink-0 text-ink-500" />
          <Item title="Create a key for a rig">A scoped API key, kept in the rig’s secret store.</Item>
        </Link>
      ),
    });
  }
  links.push({
    key: 'docs',
    node: (
      <a href={env.docsPath} className={linkClasses}>
        <Icon name="docs" className="mt-0.5 size-4 shrink-0 text-ink-500" />
        <Item title="API reference">Every endpoint with its schemas, served by this instance.</Item>
      </a>
    ),
  });
  return (
    <Panel id="overview-links" title="Next steps">
      <ul className="grid gap-2">
        {links.map((link) => (
          <li key={link.key}>{link.node}</li>
        ))}
      </ul>
    </Panel>
  );
}
