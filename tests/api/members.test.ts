import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberListSchema } from '@shared/schemas/members';
import { joinOrganisation, organisationWithRoles, signUp, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';

let context: TestContext;
let org: OrganisationWithRoles;
beforeAll(async () => {
  context = await createTestContext();
  org = await organisationWithRoles(context);
});
afterAll(async () => {
  await context?.close();
});

describe('members', () => {
  it('lists every member with role and e-mail, owners first', async () => {
    const response = await org.viewer.agent.get('/v1/members');
    expect(response.status).toBe(200);
    const { data } = memberListSchema.parse(response.body);
    expect(data.map((member) => member.role)).toEqual(['owner', 'admin', 'analyst', 'viewer']);
    expect(data[0]).toMatchObject({ id: org.owner.membershipId, userId: org.owner.userId, email: org.owner.email });
  });

  it('never lets the last owner be demoted or removed', async () => {
    const demote = await org.owner.agent.patch(`/v1/members/${org.owner.membershipId}`).send({ role: 'admin' });
    expect(demote.status).toBe(409);
    expect(demote.body.code).toBe('last_owner');
    const remove = await org.owner.agent.delete(`/v1/members/${org.owner.membershipId}`);
    expect(remove.status).toBe(409);
    expect(remove.body.code).toBe('last_owner');
  });

  it('lets an owner hand over ownership, after which the former owner can step down', async () => {
    const second = await joinOrganisation(context, await signUp(context, { organisationName: 'x' }), org.organisationId, 'analyst');
    expect((await org.owner.agent.patch(`/v1/members/${second.membershipId}`).send({ role: 'owner' })).status).toBe(200);
    expect((await org.owner.agent.patch(`/v1/members/${org.owner.membershipId}`).send({ role: 'admin' })).status).toBe(200);
    expect((await second.agent.patch(`/v1/members/${second.membershipId}`).send({ role: 'admin' })).body.code).toBe('last_owner');
    // restore for the other tests
    expect((await second.agent.patch(`/v1/members/${org.owner.membershipId}`).send({ role: 'owner' })).status).toBe(200);
    expect((await org.owner.agent.delete(`/v1/members/${second.membershipId}`)).status).toBe(204);
  });

  it('keeps the owner role in owners\' hands', async () => {
    const grant = await org.admin.agent.patch(`/v1/members/${org.viewer.membershipId}`).send({ role: 'owner' });
    expect(grant.status).toBe(403);
    expect(grant.body.code).toBe('owner_role_required');
    const demoteOwner = await org.admin.agent.patch(`/v1/members/${org.owner.membershipId}`).send({ role: 'viewer' });
    expect(demoteOwner.body.code).toBe('owner_role_required');
    const removeOwner = await org.admin.agent.delete(`/v1/members/${org.owner.membershipId}`);
    expect(removeOwner.body.code).toBe('owner_role_required');
  });

  it('stops a removed member\'s session for the organisation at once, and logs the change', async () => {
    const leaving = await joinOrganisation(context, await signUp(context, { organisationName: 'own lab' }), org.organisationId, 'analyst');
    expect((await leaving.agent.get('/v1/members')).status).toBe(200);
    expect((await org.admin.agent.delete(`/v1/members/${leaving.membershipId}`)).status).toBe(204);

    const after = await leaving.agent.get('/v1/members');
    expect(after.status).toBe(401);
    expect(after.body.code).toBe('not_authenticated');
    // The session falls back to the user's remaining organisation.
    const session = await leaving.agent.get('/v1/auth/session');
    expect(session.status).toBe(200);
    expect(session.body.activeOrganisation.name).toBe('own lab');

    const events = await org.owner.agent.get('/v1/audit-events').query({ action: 'member.removed' });
    expect(events.body.data[0]).toMatchObject({
      objectType: 'membership',
      objectId: leaving.membershipId,
      actor: { type: 'user', id: org.admin.userId },
      details: { role: 'analyst', userId: leaving.userId },
    });
  });

  it('answers unknown member ids with 404 and bad roles with 400', async () => {
    expect((await org.owner.agent.patch('/v1/members/mem_doesnotexist').send({ role: 'viewer' })).status).toBe(404);
    expect((await org.owner.agent.delete('/v1/members/mem_doesnotexist')).status).toBe(404);
    const badRole = await org.owner.agent.patch(`/v1/members/${org.viewer.membershipId}`).send({ role: 'superuser' });
    expect(badRole.status).toBe(400);
    expect(badRole.body.errors[0].pointer).toBe('#/role');
  });
});
