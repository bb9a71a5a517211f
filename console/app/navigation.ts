import type { NavSection } from '@console/components/layouts/side-nav';
import { env } from '@console/config/env';
import { paths } from '@console/config/paths';
import { hasPermission } from '@console/lib/authorization';
import type { Session } from '@shared/schemas/auth';
import type { Permission } from '@shared/schemas/permissions';

/** Optional parts of this server the console learns about at run time (e.g. the development outbox). */
export type ServerFeatures = { devOutbox?: boolean };

type NavEntry = NavSection['items'][number] & { requires?: Permission; onlyWith?: keyof ServerFeatures };
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
      { label: 'Stimuli', icon: 'stimulus', to: paths.app.stimuli.getHref(), requires: 'analyses:read' },
      { label: 'Production', icon: 'production', to: paths.app.production.getHref(), requires: 'analyses:read' },
      { label: 'Calibrations', icon: 'calibration', to: paths.app.calibrations.getHref(), requires: 'calibrations:read' },
      { label: 'Masks', icon: 'mask', to: paths.app.masks.getHref(), requires: 'masks:read' },
    ],
  },
  {
    label: 'Organisation',
    items: [
      { label: 'Members', icon: 'members', to: paths.app.members.getHref(), requires: 'members:read' },
      { label: 'Usage & plan', icon: 'usage', to: paths.app.usage.getHref(), requires: 'billing:manage' },
      { label: 'API keys', icon: 'key', to: paths.app.apiKeys.getHref(), requires: 'keys:manage' },
      { label: 'Webhooks', icon: 'webhook', to: paths.app.webhooks.getHref(), requires: 'webhooks:manage' },
    ],
  },
  {
    label: 'Developer',
    items: [
      { label: 'Developer corner', icon: 'code', to: paths.app.developer.getHref() },
      { label: 'API reference', icon: 'docs', to: env.docsPath, external: true },
      { label: 'Outbox', icon: 'mail', to: paths.app.devOutbox.getHref(), requires: 'members:manage', onlyWith: 'devOutbox' },
    ],
  },
];

export function navigationFor(session: Session, features: ServerFeatures = {}): NavSection[] {
  return groups
    .map((group) => ({
      label: group.label,
      items: group.items.filter(
        (item) => (!item.requires || hasPermission(session, item.requires)) && (!item.onlyWith || features[item.onlyWith] === true),
      ),
    }))
    .filter((group) => group.items.length > 0);
}
