import { z } from 'zod';

/**
 * One vocabulary for what a member's role allows and what an API key's scopes allow. A route names exactly one
 * of these; a principal (signed-in member or API key) either holds it or is refused.
 */
export const PERMISSION_DESCRIPTIONS = {
  'captures:read': 'Read uploaded captures and their metadata.',
  'captures:write': 'Upload and delete captures.',
  'captures:delete': 'Delete captures (owners and admins; analysts upload but do not delete).',
  'analyses:read': 'Read analyses, results and exports.',
  'analyses:write': 'Start, re-run and cancel analyses.',
  'calibrations:read': 'Read rig calibrations.',
  'calibrations:write': 'Create and change rig calibrations.',
  'masks:read': 'Read tolerance masks.',
  'masks:write': 'Create and version tolerance masks.',
  'usage:read': 'Read usage and plan limits.',
  'billing:manage': 'See plans and invoices, change the plan and open the billing portal.',
  'members:read': 'List the members of the organisation.',
  'members:manage': 'Change member roles and remove members.',
  'keys:manage': 'Create, list and revoke API keys.',
  'webhooks:manage': 'Manage webhook endpoints and deliveries.',
  'audit:read': 'Read the audit log.',
} as const;

export type Permission = keyof typeof PERMISSION_DESCRIPTIONS;

export const PERMISSIONS = Object.keys(PERMISSION_DESCRIPTIONS) as [Permission, ...Permission[]];

export const permissionSchema = z.enum(PERMISSIONS).meta({
  id: 'Permission',
  description: 'A permission held by a role or granted to an API key as a scope.',
  example: 'analyses:read',
});

export const ROLES = ['owner', 'admin', 'analyst', 'viewer'] as const;
export type Role = (typeof ROLES)[number];

export const roleSchema = z.enum(ROLES).meta({
  id: 'Role',
  description:
    'Role of a member in an organisation. owner and admin hold every permission (only an owner can grant or ' +
    'change the owner role); analyst reads and writes measurement data; viewer only reads.',
  example: 'analyst',
});

const MEASUREMENT_READ: Permission[] = [
  'captures:read',
  'analyses:read',
  'calibrations:read',
  'masks:read',
  'usage:read',
  'members:read',
];
const MEASUREMENT_WRITE: Permission[] = ['captures:write', 'analyses:write', 'calibrations:write', 'masks:write'];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  owner: PERMISSIONS,
  admin: PERMISSIONS,
  analyst: [...MEASUREMENT_READ, ...MEASUREMENT_WRITE],
  viewer: MEASUREMENT_READ,
};

export function permissionsOfRole(role: Role): readonly Permission[] {
  return ROLE_PERMISSIONS[role];
}

export const permissionCatalogueSchema = z
  .object({
    scopes: z.array(
      z.object({
        name: permissionSchema,
        description: z.string(),
      }),
    ),
    roles: z.array(
      z.object({
        role: roleSchema,
        permissions: z.array(permissionSchema),
      }),
    ),
  })
  .meta({
    id: 'PermissionCatalogue',
    description: 'Every permission (usable as an API-key scope) and the permissions each role holds.',
  });
export type PermissionCatalogue = z.infer<typeof permissionCatalogueSchema>;
