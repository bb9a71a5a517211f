import type { NavSection } from '@console/components/layouts/side-nav';
import { env } from '@console/config/env';
import { paths } from '@console/config/paths';
import { hasPermission } from '@console/lib/authorization';
import type { Session } from '@shared/schemas/auth';
import type { Permission } from '@shared/schemas/permissions';

type NavEntry = NavSection['items'][number] & { requires?: Permission };
type NavGroup = { label: string; items: NavEntry[] };

// The sidebar's sections. New screens add an entry here next to their route in router.tsx; `requires` hides an
// entry from roles that could not use the screen anyway.
const groups: NavGroup[] = [
  {
    label: 'Workspace',
    items: [
      { label: 'Overview', icon: 'overview', to: paths.app.root.getHref(), end: true },
      { label: 'Analyses', icon: 'analyses', to: paths.app.analyses.getHref(), requires: 'analyses:read' },
      { label: 'Compare', icon: 'compare', to: paths.app.compare.getHref(), requires: 'analyses:read' },
    ],
  },
  {
    label: 'Organisation',
    items: [
      { label: 'Members', icon: 'members', to: paths.app.members.getHref(), requires: 'members:read' },
      { label: 'API keys', icon: 'key', to: paths.app.apiKeys.getHref(), requires: 'keys:manage' },
    ],
  },
  {
    label: 'Developer',
    items: [{ label: 'API reference', icon: 'docs', to: env.docsPath, external: true }],
  },
];

export function navigationFor(session: Session): NavSection[] {
  return groups
    .map((group) => ({
      label: group.label,
      items: group.items.filter((item) => !item.requires || hasPermission(session, item.requires)),
    }))
    .filter((group) => group.items.length > 0);
}
