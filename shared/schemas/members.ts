import { z } from 'zod';
import { displayNameSchema, emailSchema, prefixedIdSchema, timestampSchema } from './common';
import { roleSchema } from './permissions';

export const memberSchema = z
  .object({
    id: prefixedIdSchema('mem', 'mem_Hn4Rt7Yq1Wz8Kc3Vb6Ma'),
    userId: prefixedIdSchema('usr', 'usr_Q2w8Lk3Zr5Tx9Pb1Nc0d'),
    email: emailSchema,
    displayName: displayNameSchema,
    role: roleSchema,
    joinedAt: timestampSchema,
  })
  .meta({ id: 'Member', description: 'A user\'s membership in the organisation.' });
export type Member = z.infer<typeof memberSchema>;

export const memberListSchema = z
  .object({ data: z.array(memberSchema) })
  .meta({ id: 'MemberList', description: 'Every member of the organisation, owners first, then by name.' });
export type MemberList = z.infer<typeof memberListSchema>;

export const memberParamsSchema = z.strictObject({
  memberId: prefixedIdSchema('mem', 'mem_Hn4Rt7Yq1Wz8Kc3Vb6Ma'),
});

export const changeMemberRoleRequestSchema = z
  .strictObject({ role: roleSchema })
  .meta({ id: 'ChangeMemberRoleRequest' });
export type ChangeMemberRoleRequest = z.infer<typeof changeMemberRoleRequestSchema>;
