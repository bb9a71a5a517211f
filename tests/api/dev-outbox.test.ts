import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Invitation } from '@shared/schemas/invitations';
import { organisationWithRoles, uniqueEmail, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';
import { invite } from './invitations-fixtures';

describe('development outbox with the local mail catcher', () => {
  let context: TestContext;
  let org: OrganisationWithRoles;
  beforeAll(async () => {
    context = await createTestContext({ hostedFakes: true });
    org = await organisationWithRoles(context);
  });
  afterAll(async () => {
    await context?.close();
  });

  it('lists caught invitation e-mails newest first and serves one with its text and link, to owners and admins', async () => {
    const first = uniqueEmail('outbox.first');
    const second = uniqueEmail('outbox.second');
    await invite(org.owner.agent, first, 'viewer');
    await invite(org.owner.agent, second, 'analyst');

    const listed = await org.admin.agent.get('/v1/dev/outbox');
    expect(listed.status).toBe(200);
    const summaries = listed.body.data as Array<{ id: string; to: string[]; subject: string; receivedAt: string }>;
    expect(summaries.slice(0, 2).map((message) => message.to)).toEqual([[second], [first]]);
    expect(summaries[0]!.subject).toBe('You are invited to join Kestrel Bay Acoustics on Sweepline');
    expect(summaries[0]).not.toHaveProperty('text');

    const message = await org.owner.agent.get(`/v1/dev/outbox/${summaries[0]!.id}`);
    expect(message.status).toBe(200);
    expect(message.body.text).toContain('as an analyst');
    expect(message.body.links).toEqual([expect.stringMatching(new RegExp(`^${context.origin}/invitations/[0-9A-Za-z]{43}$`))]);
    expect(message.body).not.toHaveProperty('html');

    const missing = await org.owner.agent.get('/v1/dev/outbox/999999');
    expect(missing.status).toBe(404);
    expect(missing.headers['content-type']).toMatch(/application\/problem\+json/);
  });

  it('refuses analysts and viewers', async () => {
    for (const member of [org.analyst, org.viewer]) {
      const response = await member.agent.get('/v1/dev/outbox');
      expect(response.status).toBe(403);
      expect(response.body.code).toBe('insufficient_permission');
    }
  });
});

describe('without a mail relay or catcher', () => {
  let context: TestContext;
  let org: OrganisationWithRoles;
  beforeAll(async () => {
    context = await createTestContext();
    org = await organisationWithRoles(context);
  });
  afterAll(async () => {
    await context?.close();
  });

  it('has no outbox: 404 problem', async () => {
    expect(context.deps.devOutbox).toBeUndefined();
    const response = await org.owner.agent.get('/v1/dev/outbox');
    expect(response.status).toBe(404);
    expect(response.headers['content-type']).toMatch(/application\/problem\+json/);
    expect(response.body.code).toBe('not_found');
  });

  it('still creates the invitation and says the e-mail was not sent', async () => {
    const created = await invite(org.admin.agent, uniqueEmail('no.relay'), 'analyst');
    expect(created.status).toBe('pending');
    expect(created.emailDelivery).toMatchObject({ status: 'not_sent', detail: expect.stringMatching(/SMTP_URL/) });
    const listed = (await org.admin.agent.get('/v1/invitations')).body.data as Invitation[];
    expect(listed.map((invitation) => invitation.id)).toContain(created.id);
  });
});
