import { changeMemberRoleRequestSchema, memberListSchema, memberParamsSchema, memberSchema } from '@shared/schemas/members';
import { defineRoute } from '@server/http/define-route';
import { changeMemberRole, listOrganisationMembers, removeMember } from './members.service';

export const memberRoutes = [
  defineRoute({
    method: 'get',
    path: '/members',
    operationId: 'listMembers',
    summary: 'List members',
    description: 'Every member of the active organisation with their role.',
    tags: ['Members'],
    permission: 'members:read',
    responses: { 200: { description: 'The members.', schema: memberListSchema } },
    handler: async ({ deps, principal }) => ({
      status: 200,
      body: { data: await listOrganisationMembers(deps, principal.organisationId) },
    }),
  }),
  defineRoute({
    method: 'patch',
    path: '/members/{memberId}',
    operationId: 'changeMemberRole',
    summary: 'Change a member\'s role',
    description:
      'Only an owner can grant the owner role or change an owner\'s role. The last owner cannot be demoted ' +
      '(409 last_owner). Takes effect on the member\'s next request.',
    tags: ['Members'],
    permission: 'members:manage',
    request: { params: memberParamsSchema, body: changeMemberRoleRequestSchema },
    responses: { 200: { description: 'The member with the new role.', schema: memberSchema } },
    problems: ['not_found', 'owner_role_required', 'last_owner'],
    handler: async ({ deps, principal, params, body }) => ({
      status: 200,
      body: await changeMemberRole(deps, principal, params.memberId, body.role),
    }),
  }),
  defineRoute({
    method: 'delete',
    path: '/members/{memberId}',
    operationId: 'removeMember',
    summary: 'Remove a member',
    description:
      'Removes the membership (the user account stays). Only an owner can remove an owner; the last owner cannot ' +
      'be removed (409 last_owner). The removed member\'s session stops working for this organisation at once.',
    tags: ['Members'],
    permission: 'members:manage',
    request: { params: memberParamsSchema },
    responses: { 204: { description: 'Removed.' } },
    problems: ['not_found', 'owner_role_required', 'last_owner'],
    handler: async ({ deps, principal, params }) => {
      await removeMember(deps, principal, params.memberId);
      return { status: 204 };
    },
  }),
];
