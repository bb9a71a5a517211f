import type { RouteDefinition } from '@server/http/define-route';
import { apiKeyRoutes } from './api-keys/api-keys.routes';
import { auditRoutes } from './audit/audit.routes';
import { authRoutes } from './auth/auth.routes';
import { healthRoutes } from './health/health.routes';
import { memberRoutes } from './members/members.routes';
import { permissionRoutes } from './permissions/permissions.routes';

/** Every /v1 endpoint, in documentation order. A new module adds its list here and nowhere else. */
export const v1Routes: RouteDefinition[] = [
  ...healthRoutes,
  ...authRoutes,
  ...memberRoutes,
  ...permissionRoutes,
  ...apiKeyRoutes,
  ...auditRoutes,
];
