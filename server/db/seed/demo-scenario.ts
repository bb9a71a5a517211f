import type { Permission, Role } from '@shared/schemas/permissions';

/**
 * The invented company of the local demo. The passwords are fixed on purpose so the start-up banner can
 * print them; they are for a loopback demo only, and no demo data is seeded in production.
 */
export const DEMO_ORGANISATION_NAME = 'Kestrel Bay Acoustics';
export const DEMO_SECOND_ORGANISATION_NAME = 'Kestrel Bay Service Lab';

export interface DemoUser {
  role: Role;
  email: string;
  displayName: string;
  password: string;
}

export const DEMO_USERS: DemoUser[] = [
  { role: 'owner', email: 'owner@kestrelbay.example', displayName: 'Ines Halvorsen', password: 'kestrel-owner-demo' },
  { role: 'admin', email: 'admin@kestrelbay.example', displayName: 'Tomas Reyes', password: 'kestrel-admin-demo' },
  { role: 'analyst', email: 'analyst@kestrelbay.example', displayName: 'Mara Lindqvist', password: 'kestrel-analyst-demo' },
  { role: 'viewer', email: 'viewer@kestrelbay.example', displayName: 'Joel Achebe', password: 'kestrel-viewer-demo' },
];

export const DEMO_API_KEY = {
  name: 'KB-65 line 1 rig (demo)',
  scopes: ['captures:read', 'captures:write', 'analyses:read', 'analyses:write', 'calibrations:read', 'masks:read'] as Permission[],
};
