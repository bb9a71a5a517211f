import { PERMISSION_DESCRIPTIONS, PERMISSIONS, permissionCatalogueSchema, ROLE_PERMISSIONS, ROLES } from '@shared/schemas/permissions';
import { defineRoute } from '@server/http/define-route';

export const permissionRoutes = [
  defineRoute({
    method: 'get',
    path: '/permissions',
    operationId: 'listPermissions',
    summary: 'Permissions, scopes and roles',
    description: 'Every permission (each usable as an API-key scope) and what each role holds.',
    tags: ['Members'],
    auth: 'principal',
    responses: { 200: { description: 'The permission catalogue.', schema: permissionCatalogueSchema } },
    handler: async () => ({
      status: 200,
      body: {
        scopes: PERMISSIONS.map((name) => ({ name, description: PERMISSION_DESCRIPTIONS[name] })),
        roles: ROLES.map((role) => ({ role, permissions: [...ROLE_PERMISSIONS[role]] })),
      },
    }),
  }),
];
