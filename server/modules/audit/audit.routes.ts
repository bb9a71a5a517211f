import { auditEventListQuerySchema, auditEventPageSchema } from '@shared/schemas/audit-events';
import { defineRoute } from '@server/http/define-route';
import { listAuditEventsPage } from './audit.service';

export const auditRoutes = [
  defineRoute({
    method: 'get',
    path: '/audit-events',
    operationId: 'listAuditEvents',
    summary: 'List audit events',
    description: 'Who did what to which object in the active organisation, newest first.',
    tags: ['Audit'],
    permission: 'audit:read',
    request: { query: auditEventListQuerySchema },
    responses: { 200: { description: 'A page of audit events.', schema: auditEventPageSchema } },
    problems: ['invalid_cursor'],
    handler: async ({ deps, principal, query }) => ({
      status: 200,
      body: await listAuditEventsPage(deps, principal.organisationId, query),
    }),
  }),
];
