import type { RouteDefinition } from '@server/http/define-route';
import { apiKeyRoutes } from './api-keys/api-keys.routes';
import { analysisRoutes } from './analyses/analyses.routes';
import { auditRoutes } from './audit/audit.routes';
import { captureRoutes } from './captures/captures.routes';
import { stimulusRoutes } from './stimuli/stimuli.routes';
import { authRoutes } from './auth/auth.routes';
import { healthRoutes } from './health/health.routes';
import { memberRoutes } from './members/members.routes';
import { invitationRoutes } from './invitations/invitations.routes';
import { devOutboxRoutes } from './dev-outbox/dev-outbox.routes';
import { permissionRoutes } from './permissions/permissions.routes';
import { calibrationRoutes } from './calibrations/calibrations.routes';
import { maskRoutes } from './masks/masks.routes';
import { productionRoutes } from './production/production.routes';
import { usageRoutes } from './usage/usage.routes';
import { dailyUsageRoutes } from './usage/daily-usage.routes';
import { billingRoutes } from './billing/billing.routes';
import { webhookRoutes } from './webhook-endpoints/webhooks.routes';

/** Every /v1 endpoint, in documentation order. A new module adds its list here and nowhere else. */
export const v1Routes: RouteDefinition[] = [
  ...healthRoutes,
  ...authRoutes,
  ...memberRoutes,
  ...invitationRoutes,
  ...permissionRoutes,
  ...apiKeyRoutes,
  ...auditRoutes,
  ...stimulusRoutes,
  ...captureRoutes,
  ...analysisRoutes,
  ...calibrationRoutes,
  ...maskRoutes,
  ...productionRoutes,
  ...usageRoutes,
  ...dailyUsageRoutes,
  ...billingRoutes,
  ...webhookRoutes,
  ...devOutboxRoutes,
];
