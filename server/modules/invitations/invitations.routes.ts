import { z } from 'zod';
import { sessionSchema } from '@shared/schemas/auth';
import {
  acceptInvitationRequestSchema,
  createInvitationRequestSchema,
  INVITATION_EMAILS_PER_HOUR,
  INVITATION_LIFETIME_DAYS,
  invitationListSchema,
  invitationLookupQuerySchema,
  invitationLookupSchema,
  invitationParamsSchema,
  invitationSchema,
} from '@shared/schemas/invitations';
import { defineRoute } from '@server/http/define-route';
import { acceptInvitation, lookUpInvitation } from './invitation-acceptance';
import { createInvitation, listInvitations, resendInvitation, revokeInvitation } from './invitations.service';

const EMAIL_NOTE =
  'The e-mail goes out through the configured mail relay with a single-use link `{PUBLIC_ORIGIN}/invitations/{token}`. ' +
  'If the relay is down or refuses it, or no relay is configured, the invitation is kept and `emailDelivery` says so; resend it later. ' +
  `At most ${INVITATION_EMAILS_PER_HOUR} invitation e-mails (first sends and resends) per organisation and rolling hour (429 invitations_throttled).`;

export const invitationRoutes = [
  defineRoute({
    method: 'get',
    path: '/invitations',
    operationId: 'listInvitations',
    summary: 'List open invitations',
    description: 'Invitations of the active organisation not yet accepted or revoked, newest first; expired ones show `status: expired` and can be resent.',
    tags: ['Members'],
    permission: 'members:manage',
    responses: { 200: { description: 'The open invitations.', schema: invitationListSchema } },
    handler: async ({ deps, principal }) => ({ status: 200, body: { data: await listInvitations(deps, principal.organisationId) } }),
  }),
  defineRoute({
    method: 'post',
    path: '/invitations',
    operationId: 'createInvitation',
    summary: 'Invite someone by e-mail',
    description:
      `Invites an e-mail address to join the active organisation with a role; the link works for ${INVITATION_LIFETIME_DAYS} days. ` +
      'Only an owner can invite an owner (403 owner_role_required). A current member: 409 already_member; an address with a pending ' +
      `invitation: 409 invitation_pending (its id in \`invitationId\`; resend that one instead). ${EMAIL_NOTE}`,
    tags: ['Members'],
    permission: 'members:manage',
    request: { body: createInvitationRequestSchema },
    responses: {
      201: {
        description: 'The invitation, and what happened to its e-mail.',
        schema: invitationSchema,
        headers: { location: { description: 'URI of the invitation (DELETE it to revoke).', schema: z.string() } },
      },
    },
    problems: ['owner_role_required', 'already_member', 'invitation_pending', 'invitations_throttled'],
    idempotency: 'optional',
    handler: async ({ deps, principal, body }) => {
      const invitation = await createInvitation(deps, principal, body);
      return { status: 201, body: invitation, headers: { Location: `/v1/invitations/${invitation.id}` } };
    },
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/{invitationId}/resend',
    operationId: 'resendInvitation',
    summary: 'Resend an invitation',
    description:
      `Sends a new link (the previous one stops working at once) and restarts the ${INVITATION_LIFETIME_DAYS}-day expiry, also for an expired invitation. ` +
      `Accepted or revoked invitations: 409 invitation_closed. ${EMAIL_NOTE}`,
    tags: ['Members'],
    permission: 'members:manage',
    request: { params: invitationParamsSchema },
    responses: { 200: { description: 'The invitation with its new expiry and e-mail outcome.', schema: invitationSchema } },
    problems: ['not_found', 'owner_role_required', 'invitation_closed', 'invitations_throttled'],
    handler: async ({ deps, principal, params }) => ({ status: 200, body: await resendInvitation(deps, principal, params.invitationId) }),
  }),
  defineRoute({
    method: 'delete',
    path: '/invitations/{invitationId}',
    operationId: 'revokeInvitation',
    summary: 'Revoke an invitation',
    description: 'The link stops working at once (410 invitation_revoked for whoever opens it). Accepted invitations: 409 invitation_closed.',
    tags: ['Members'],
    permission: 'members:manage',
    request: { params: invitationParamsSchema },
    responses: { 204: { description: 'Revoked.' } },
    problems: ['not_found', 'owner_role_required', 'invitation_closed'],
    handler: async ({ deps, principal, params }) => {
      await revokeInvitation(deps, principal, params.invitationId);
      return { status: 204 };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/invitations/lookup',
    operationId: 'lookUpInvitation',
    summary: 'Look up an invitation link',
    description:
      'What an invitation link offers (organisation, role, address, expiry), for the page that accepts it. No sign-in needed: the token ' +
      'is the credential. Unknown or replaced link: 404 not_found; expired: 410 invitation_expired; revoked: 410 invitation_revoked; ' +
      'already accepted: 410 invitation_used.',
    tags: ['Members'],
    auth: 'public',
    request: { query: invitationLookupQuerySchema },
    responses: { 200: { description: 'The invitation as its recipient sees it.', schema: invitationLookupSchema } },
    problems: ['not_found', 'invitation_expired', 'invitation_revoked', 'invitation_used'],
    handler: async ({ deps, query }) => ({ status: 200, body: await lookUpInvitation(deps, query.token) }),
  }),
  defineRoute({
    method: 'post',
    path: '/invitations/accept',
    operationId: 'acceptInvitation',
    summary: 'Accept an invitation',
    description:
      'Joins the invited organisation with the invited role and signs in there (sets the `swl_session` cookie). Signed in as the invited ' +
      'address: send only the token (another address: 403 invitation_email_mismatch; already a member: 409 already_member). New to ' +
      'Sweepline: send the token with displayName and password, and the account is created for the invited address (an account with ' +
      'that address exists already: 409 email_already_registered; sign in first). The link is spent once accepted.',
    tags: ['Members'],
    auth: 'public',
    request: { body: acceptInvitationRequestSchema },
    responses: { 200: { description: 'Joined, and signed in to the organisation.', schema: sessionSchema } },
    problems: [
      'not_found',
      'invitation_expired',
      'invitation_revoked',
      'invitation_used',
      'invitation_email_mismatch',
      'already_member',
      'email_already_registered',
      'not_authenticated',
      'csrf_origin_mismatch',
    ],
    handler: async ({ deps, req, res, body }) => ({ status: 200, body: await acceptInvitation(deps, req, res, body) }),
  }),
];
