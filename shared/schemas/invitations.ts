import { z } from 'zod';
import { PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './auth';
import { displayNameSchema, emailSchema, organisationNameSchema, prefixedIdSchema, timestampSchema } from './common';
import { roleSchema } from './permissions';

/** How long an invitation link stays usable after it was (re)sent. */
export const INVITATION_LIFETIME_DAYS = 7;

/** Invitation e-mails (first sends and resends together) one organisation may send in a rolling hour. */
export const INVITATION_EMAILS_PER_HOUR = 30;

export const invitationStatusSchema = z.enum(['pending', 'accepted', 'revoked', 'expired']).meta({
  id: 'InvitationStatus',
  description: 'pending until accepted or revoked; expired once `expiresAt` has passed (a resend makes it pending again).',
  example: 'pending',
});

export const invitationEmailDeliverySchema = z
  .object({
    status: z.enum(['sent', 'failed', 'not_sent']).meta({
      description:
        'sent: the mail relay took the message. failed: the relay refused it or could not be reached (resend later). ' +
        'not_sent: no mail relay is configured on this server.',
    }),
    detail: z.string().nullable().meta({ description: 'Why the e-mail was not sent, when it was not.' }),
    lastAttemptAt: timestampSchema,
    attempts: z.number().int().min(1).meta({ description: 'E-mails tried for this invitation: the first and every resend.' }),
  })
  .meta({ id: 'InvitationEmailDelivery', description: 'What happened to the invitation e-mail.' });

export const invitationSchema = z
  .object({
    id: prefixedIdSchema('inv', 'inv_Lp4Xw9Tz2Qb7Rk1Vm5Nc'),
    email: emailSchema,
    role: roleSchema,
    status: invitationStatusSchema,
    expiresAt: timestampSchema,
    invitedBy: z.string().meta({ description: 'Who sent the invitation, as shown in the e-mail.', example: 'Ines Halvorsen' }),
    createdAt: timestampSchema,
    emailDelivery: invitationEmailDeliverySchema,
  })
  .meta({ id: 'Invitation', description: 'An e-mail invitation to join the organisation with a role. The link token is only in the e-mail.' });
export type Invitation = z.infer<typeof invitationSchema>;

export const invitationListSchema = z
  .object({ data: z.array(invitationSchema) })
  .meta({ id: 'InvitationList', description: 'Open invitations (pending or expired, not yet accepted or revoked), newest first.' });
export type InvitationList = z.infer<typeof invitationListSchema>;

export const createInvitationRequestSchema = z
  .strictObject({
    email: emailSchema,
    role: roleSchema,
  })
  .meta({ id: 'CreateInvitationRequest', description: 'Whom to invite and with which role. Only an owner can invite an owner.' });
export type CreateInvitationRequest = z.infer<typeof createInvitationRequestSchema>;

export const invitationParamsSchema = z.strictObject({
  invitationId: prefixedIdSchema('inv', 'inv_Lp4Xw9Tz2Qb7Rk1Vm5Nc'),
});

/** Link tokens are 43 base62 characters (≈ 256 random bits). */
export const invitationTokenSchema = z
  .string()
  .regex(/^[0-9A-Za-z]{43}$/, 'must be the 43-character token from the invitation link')
  .meta({ description: 'The token from the invitation link (the last path segment).', example: 'R8mK2vQ9xL4pT7wZ1nB5cF3hJ6dS0gY2aE8uI4oP7qW' });

export const invitationLookupQuerySchema = z.strictObject({ token: invitationTokenSchema });

export const invitationLookupSchema = z
  .object({
    organisationName: organisationNameSchema,
    role: roleSchema,
    email: emailSchema,
    expiresAt: timestampSchema,
    invitedBy: z.string().meta({ example: 'Ines Halvorsen' }),
    accountExists: z.boolean().meta({
      description: 'Whether an account with the invited address exists: then accept it signed in, else sign up while accepting.',
    }),
  })
  .meta({ id: 'InvitationLookup', description: 'What an invitation link offers, for the page that accepts it.' });
export type InvitationLookup = z.infer<typeof invitationLookupSchema>;

export const acceptInvitationRequestSchema = z
  .strictObject({
    token: invitationTokenSchema,
    displayName: displayNameSchema.optional().meta({ description: 'With `password`: create the account while accepting.' }),
    password: z
      .string()
      .min(PASSWORD_MIN_LENGTH)
      .max(PASSWORD_MAX_LENGTH)
      .optional()
      .meta({ description: `With \`displayName\`: the new account's password, ${PASSWORD_MIN_LENGTH} to ${PASSWORD_MAX_LENGTH} characters.` }),
  })
  .refine((body) => (body.displayName === undefined) === (body.password === undefined), {
    message: 'displayName and password are sent together (to sign up) or not at all (to join as the signed-in user)',
    path: ['password'],
  })
  .meta({
    id: 'AcceptInvitationRequest',
    description:
      'Without displayName and password: the signed-in user (session cookie) joins, if the invitation was sent to their address. ' +
      'With both: a new account for the invited address is created and joins.',
  });
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;
