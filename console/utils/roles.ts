import { ROLES, type Role } from '@shared/schemas/permissions';

export { ROLES };

const labels: Record<Role, string> = { owner: 'Owner', admin: 'Admin', analyst: 'Analyst', viewer: 'Viewer' };

const summaries: Record<Role, string> = {
  owner: 'Everything, including granting and changing the owner role.',
  admin: 'Manages members and API keys and works with all measurement data; cannot grant the owner role.',
  analyst: 'Uploads captures, runs analyses and manages calibrations and masks.',
  viewer: 'Reads captures, analyses and results; changes nothing.',
};

export const roleLabel = (role: Role): string => labels[role] ?? role;
export const roleSummary = (role: Role): string => summaries[role] ?? '';
