import { z } from 'zod';
import { prefixedIdSchema, timestampSchema } from './common';
import { pageQueryShape, pageSchema } from './pagination';

export const AUDIT_ACTIONS = [
  'organisation.created',
  'member.role_changed',
  'member.removed',
  'api_key.created',
  'api_key.revoked',
  'calibration.created',
  'calibration_settings.updated',
  'mask.created',
  'mask.version_created',
  'webhook_endpoint.created',
  'webhook_endpoint.updated',
  'webhook_endpoint.enabled',
  'webhook_endpoint.disabled',
  'webhook_endpoint.secret_rotated',
  'webhook_endpoint.deleted',
  'invitation.created',
  'invitation.resent',
  'invitation.revoked',
  'invitation.accepted',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const auditActorSchema = z
  .object({
    type: z.enum(['user', 'api_key']),
    id: z.string().meta({ example: 'usr_Q2w8Lk3Zr5Tx9Pb1Nc0d' }),
    label: z.string().meta({ description: 'Display name of the user or name of the key when it acted.', example: 'Mara Lindqvist' }),
  })
  .meta({ id: 'AuditActor' });

export const auditEventSchema = z
  .object({
    id: prefixedIdSchema('aud', 'aud_Zx3Cv6Bn9Mq2Wl5Kr8Td'),
    action: z.enum(AUDIT_ACTIONS).meta({ example: 'api_key.created' }),
    actor: auditActorSchema,
    objectType: z.string().meta({ example: 'api_key' }),
    objectId: z.string().meta({ example: 'key_Vd8Nq2Lm5Rx1Tz7Pc4Ws' }),
    createdAt: timestampSchema,
    details: z.record(z.string(), z.unknown()).meta({ example: { name: 'KB-65 line 2 rig', scopes: ['captures:write'] } }),
  })
  .meta({ id: 'AuditEvent', description: 'Who did what to which object, and when.' });
export type AuditEvent = z.infer<typeof auditEventSchema>;

export const auditEventListQuerySchema = z.strictObject({
  ...pageQueryShape,
  action: z.enum(AUDIT_ACTIONS).optional().meta({ description: 'Only events of this action.' }),
  objectId: z.string().min(1).max(64).optional().meta({ description: 'Only events about this object.' }),
});
export type AuditEventListQuery = z.infer<typeof auditEventListQuerySchema>;

export const auditEventPageSchema = pageSchema(auditEventSchema, 'AuditEventPage');
