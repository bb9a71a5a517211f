import { createHash } from 'node:crypto';
import { once } from 'node:events';
import net from 'node:net';
import type { AddressInfo } from 'node:net';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Session } from '@shared/schemas/auth';
import { INVITATION_EMAILS_PER_HOUR, INVITATION_LIFETIME_DAYS, type Invitation } from '@shared/schemas/invitations';
import { invitations } from '@server/db/tables';
import { createMailer } from '@server/email/mailer';
import { manualClock } from '@server/lib/clock';
import { browserAgent, organisationWithRoles, signUp, uniqueEmail, type OrganisationWithRoles } from '../support/actors';
import { createTestContext, type TestContext } from '../support/test-app';
import { acceptLinkOf, caughtInvitationFor, invitationTokenFor, invite, lastOutboxId } from './invitations-fixtures';

// The clock starts at the real time (the cookie jar drops cookies that expired in real time) and only runs ahead.
const clock = manualClock(new Date(Math.ceil(Date.now() / 1000) * 1000));
const DAY_MS = 24 * 3600 * 1000;
const NEW_PASSWORD = 'kb-h40-left-cup-sweep';

let context: TestContext;
let org: OrganisationWithRoles;

beforeAll(async () => {
  context = await createTestContext({ clock, hostedFakes: true });
  org = await organisationWithRoles(context, 'Kestrel Bay Acoustics');
});
afterAll(async () => {
  await context?.close();
});

const lookup = (token: string) => browserAgent(context).get('/v1/invitations/lookup').query({ token });

describe('inviting a new person', () => {
  it('e-mails a working link; the person signs up through it and is signed in with the invited role', async () => {
    const email = uniqueEmail('new.analyst');
    const before = lastOutboxId(context);
    const created = await invite(org.owner.agent, email, 'analyst');
    expect(created).toMatchObject({ email, role: 'analyst', status: 'pending', invitedBy: 'Ines Halvorsen' });
    expect(created.emailDelivery).toMatchObject({ status: 'sent', detail: null, attempts: 1 });
    expect(new Date(created.expiresAt).getTime() - clock.now().getTime()).toBe(INVITATION_LIFETIME_DAYS * DAY_MS);

    const message = await caughtInvitationFor(context, email, before);
    expect(message.subject).toBe('You are invited to join Kestrel Bay Acoustics on Sweepline');
    const { token } = acceptLinkOf(context, message);
    expect(token).toMatch(/^[0-9A-Za-z]{43}$/);

    const looked = await lookup(token);
    expect(looked.status).toBe(200);
    expect(looked.body).toEqual({
      organisationName: 'Kestrel Bay Acoustics',
      role: 'analyst',
      email,
      expiresAt: created.expiresAt,
      invitedBy: 'Ines Halvorsen',
      accountExists: false,
    });

    // The password follows sign-up's rule (at least 12 characters).
    const newcomer = browserAgent(context);
    const short = await newcomer.post('/v1/invitations/accept').send({ token, displayName: 'Noor Vantongeren', password: 'too-short' });
    expect(short.status).toBe(400);
    expect(short.body.errors).toEqual([expect.objectContaining({ pointer: '#/password' })]);

    const accepted = await newcomer.post('/v1/invitations/accept').send({ token, displayName: 'Noor Vantongeren', password: NEW_PASSWORD });
    expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
    const session = accepted.body as Session;
    expect(session.user).toMatchObject({ email, displayName: 'Noor Vantongeren' });
    expect(session.activeOrganisation).toMatchObject({ id: org.organisationId, role: 'analyst' });

    // Signed in: the cookie works, and the analyst role's permissions apply.
    expect((await newcomer.get('/v1/auth/session')).body.activeOrganisation.role).toBe('analyst');
    expect((await newcomer.get('/v1/analyses')).status).toBe(200);
    expect((await newcomer.get('/v1/api-keys')).status).toBe(403);
    const members = (await org.owner.agent.get('/v1/members')).body.data as Array<{ email: string; role: string }>;
    expect(members).toContainEqual(expect.objectContaining({ email, role: 'analyst' }));

    // The link is spent, and the invitation left the open list.
    expect((await lookup(token)).body.code).toBe('invitation_used');
    expect((await lookup(token)).status).toBe(410);
    const again = await browserAgent(context).post('/v1/invitations/accept').send({ token, displayName: 'Someone Else', password: NEW_PASSWORD });
    expect(again.status).toBe(410);
    const open = (await org.owner.agent.get('/v1/invitations')).body.data as Invitation[];
    expect(open.map((invitation) => invitation.id)).not.toContain(created.id);

    // The new account is a normal one: it signs in with the chosen password.
    const signIn = await browserAgent(context).post('/v1/auth/sign-in').send({ email, password: NEW_PASSWORD });
    expect(signIn.status).toBe(200);

    const audit = await org.owner.agent.get('/v1/audit-events').query({ objectId: created.id });
    expect((audit.body.data as Array<{ action: string }>).map((event) => event.action).sort()).toEqual(['invitation.accepted', 'invitation.created']);
  });

  it('stores only the SHA-256 of the link token', async () => {
    const email = uniqueEmail('hashed');
    const before = lastOutboxId(context);
    const created = await invite(org.admin.agent, email, 'viewer');
    const token = await invitationTokenFor(context, email, before);
    const [row] = await context.deps.db.select().from(invitations).where(eq(invitations.id, created.id));
    // FIPS 180-4 SHA-256, computed here with node:crypto independently of the server's helper.
    expect(row!.tokenHash).toBe(createHash('sha256').update(token, 'utf8').digest('hex'));
    expect(JSON.stringify(row)).not.toContain(token);
  });
});

describe('inviting someone who already has an account', () => {
  it('joins as the signed-in user of the invited address, keeping the other organisation', async () => {
    const elsewhere = await signUp(context, { organisationName: 'KB Tweeter Line', displayName: 'Tomas Reyes', email: uniqueEmail('tomas') });
    const before = lastOutboxId(context);
    await invite(org.owner.agent, elsewhere.email.toUpperCase(), 'viewer');
    const token = await invitationTokenFor(context, elsewhere.email, before);
    expect((await lookup(token)).body).toMatchObject({ accountExists: true, role: 'viewer', email: elsewhere.email });

    // Signing up again with the invited address is refused: that account exists.
    const signUpAgain = await browserAgent(context).post('/v1/invitations/accept').send({ token, displayName: 'Tomas Reyes', password: NEW_PASSWORD });
    expect(signUpAgain.status).toBe(409);
    expect(signUpAgain.body.code).toBe('email_already_registered');

    const anonymous = await browserAgent(context).post('/v1/invitations/accept').send({ token });
    expect(anonymous.status).toBe(401);
    expect(anonymous.body.code).toBe('not_authenticated');

    const someoneElse = await org.viewer.agent.post('/v1/invitations/accept').send({ token });
    expect(someoneElse.status).toBe(403);
    expect(someoneElse.body.code).toBe('invitation_email_mismatch');

    const joined = await elsewhere.agent.post('/v1/invitations/accept').send({ token });
    expect(joined.status, JSON.stringify(joined.body)).toBe(200);
    const session = joined.body as Session;
    expect(session.activeOrganisation).toMatchObject({ id: org.organisationId, role: 'viewer' });
    expect(session.memberships.map((membership) => membership.organisationId).sort()).toEqual([elsewhere.organisationId, org.organisationId].sort());
    expect((await elsewhere.agent.get('/v1/auth/session')).body.activeOrganisation.id).toBe(org.organisationId);
  });
});

describe('duplicates', () => {
  it('refuses to invite a member (409 already_member) and a pending address (409 invitation_pending, pointing at it)', async () => {
    const member = await org.owner.agent.post('/v1/invitations').send({ email: org.analyst.email, role: 'viewer' });
    expect(member.status).toBe(409);
    expect(member.body.code).toBe('already_member');
    expect(member.headers['content-type']).toMatch(/application\/problem\+json/);

    const email = uniqueEmail('twice');
    const first = await invite(org.owner.agent, email, 'analyst');
    const second = await org.admin.agent.post('/v1/invitations').send({ email: email.toUpperCase(), role: 'viewer' });
    expect(second.status).toBe(409);
    expect(second.body).toMatchObject({ code: 'invitation_pending', invitationId: first.id });
    expect(second.body.detail).toMatch(/resend/i);
  });
});

describe('roles', () => {
  it('analysts and viewers cannot list or send invitations', async () => {
    for (const member of [org.analyst, org.viewer]) {
      const sent = await member.agent.post('/v1/invitations').send({ email: uniqueEmail('nope'), role: 'viewer' });
      expect(sent.status).toBe(403);
      expect(sent.body.code).toBe('insufficient_permission');
      expect((await member.agent.get('/v1/invitations')).status).toBe(403);
    }
  });

  it('an admin cannot invite an owner or touch an owner invitation; an owner can', async () => {
    const refused = await org.admin.agent.post('/v1/invitations').send({ email: uniqueEmail('co.owner'), role: 'owner' });
    expect(refused.status).toBe(403);
    expect(refused.body.code).toBe('owner_role_required');

    const ownerInvite = await invite(org.owner.agent, uniqueEmail('co.owner'), 'owner');
    expect((await org.admin.agent.delete(`/v1/invitations/${ownerInvite.id}`)).body.code).toBe('owner_role_required');
    expect((await org.admin.agent.post(`/v1/invitations/${ownerInvite.id}/resend`)).body.code).toBe('owner_role_required');
    expect((await invite(org.admin.agent, uniqueEmail('second.admin'), 'admin')).role).toBe('admin');
  });
});

describe('isolation', () => {
  it('another organisation cannot see, resend or revoke the invitations', async () => {
    const created = await invite(org.owner.agent, uniqueEmail('isolated'), 'viewer');
    const other = await signUp(context, { organisationName: 'KB Headphone Lab', email: uniqueEmail('other.owner') });
    const listed = (await other.agent.get('/v1/invitations')).body.data as Invitation[];
    expect(listed).toEqual([]);
    expect((await other.agent.delete(`/v1/invitations/${created.id}`)).status).toBe(404);
    expect((await other.agent.post(`/v1/invitations/${created.id}/resend`)).status).toBe(404);
    const stillOpen = (await org.owner.agent.get('/v1/invitations')).body.data as Invitation[];
    expect(stillOpen.find((invitation) => invitation.id === created.id)?.status).toBe('pending');
  });
});

describe('revoke and resend', () => {
  it('a revoked link answers 410 and cannot be revoked or resent again', async () => {
    const email = uniqueEmail('revoked');
    const before = lastOutboxId(context);
    const created = await invite(org.owner.agent, email, 'analyst');
    const token = await invitationTokenFor(context, email, before);
    expect((await org.admin.agent.delete(`/v1/invitations/${created.id}`)).status).toBe(204);
    const looked = await lookup(token);
    expect(looked.status).toBe(410);
    expect(looked.body.code).toBe('invitation_revoked');
    expect((await browserAgent(context).post('/v1/invitations/accept').send({ token, displayName: 'Late Comer', password: NEW_PASSWORD })).status).toBe(410);
    expect((await org.owner.agent.delete(`/v1/invitations/${created.id}`)).body.code).toBe('invitation_closed');
    expect((await org.owner.agent.post(`/v1/invitations/${created.id}/resend`)).body.code).toBe('invitation_closed');
    // A revoked address can be invited afresh.
    expect((await invite(org.owner.agent, email, 'viewer')).status).toBe('pending');
  });

  it('a resend mails a new link and the old one stops working', async () => {
    const email = uniqueEmail('resent');
    let before = lastOutboxId(context);
    const created = await invite(org.owner.agent, email, 'analyst');
    const oldToken = await invitationTokenFor(context, email, before);
    before = lastOutboxId(context);
    const resent = await org.owner.agent.post(`/v1/invitations/${created.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.emailDelivery).toMatchObject({ status: 'sent', attempts: 2 });
    const newToken = await invitationTokenFor(context, email, before);
    expect(newToken).not.toBe(oldToken);
    expect((await lookup(oldToken)).status).toBe(404);
    expect((await lookup(newToken)).status).toBe(200);
  });
});

describe('e-mail failures', () => {
  it('keeps the invitation when the relay is down, says so, and a later resend delivers it', async () => {
    // A port that refuses connections: the relay is "down".
    const probe = net.createServer().listen(0, '127.0.0.1');
    await once(probe, 'listening');
    const closedPort = (probe.address() as AddressInfo).port;
    await new Promise<void>((resolve) => probe.close(() => resolve()));

    const workingMailer = context.deps.mailer;
    context.deps.mailer = createMailer({ host: '127.0.0.1', port: closedPort, secure: false, fromAddress: 'Sweepline <no-reply@sweepline.example>' });
    const email = uniqueEmail('relay.down');
    let created: Invitation;
    try {
      const response = await org.owner.agent.post('/v1/invitations').send({ email, role: 'viewer' });
      expect(response.status).toBe(201);
      created = response.body as Invitation;
    } finally {
      context.deps.mailer.close();
      context.deps.mailer = workingMailer;
    }
    expect(created.emailDelivery.status).toBe('failed');
    expect(created.emailDelivery.detail).toMatch(/SMTP relay/);
    const listed = (await org.owner.agent.get('/v1/invitations')).body.data as Invitation[];
    expect(listed.find((invitation) => invitation.id === created.id)?.emailDelivery.status).toBe('failed');

    const before = lastOutboxId(context);
    const resent = await org.owner.agent.post(`/v1/invitations/${created.id}/resend`);
    expect(resent.body.emailDelivery).toMatchObject({ status: 'sent', detail: null });
    expect((await lookup(await invitationTokenFor(context, email, before))).status).toBe(200);
  });
});

describe('per-organisation sending limit', () => {
  it(`allows ${INVITATION_EMAILS_PER_HOUR} invitation e-mails an hour, then answers 429 with Retry-After until the hour has passed`, async () => {
    const sender = await signUp(context, { organisationName: 'KB Busy Recruiter', email: uniqueEmail('busy') });
    const first = await invite(sender.agent, uniqueEmail('batch'), 'viewer');
    for (let sent = 1; sent < INVITATION_EMAILS_PER_HOUR - 1; sent += 1) await invite(sender.agent, uniqueEmail('batch'), 'viewer');
    // Resends count too.
    expect((await sender.agent.post(`/v1/invitations/${first.id}/resend`)).status).toBe(200);

    const refused = await sender.agent.post('/v1/invitations').send({ email: uniqueEmail('batch'), role: 'viewer' });
    expect(refused.status).toBe(429);
    expect(refused.body.code).toBe('invitations_throttled');
    expect(Number(refused.headers['retry-after'])).toBeGreaterThan(3500);
    // Other organisations are not affected.
    await invite(org.owner.agent, uniqueEmail('unaffected'), 'viewer');

    clock.advanceSeconds(3601);
    await invite(sender.agent, uniqueEmail('batch'), 'viewer');
  });
});

// Last: moving the clock past the expiry also ends every session opened above.
describe('expiry', () => {
  it(`a link expires after ${INVITATION_LIFETIME_DAYS} days (410); a resend revives it with a new link and expiry`, async () => {
    const email = uniqueEmail('expiring');
    const other = uniqueEmail('expiring.reinvite');
    let before = lastOutboxId(context);
    const created = await invite(org.owner.agent, email, 'analyst');
    const token = await invitationTokenFor(context, email, before);
    await invite(org.owner.agent, other, 'viewer');

    clock.advanceSeconds(INVITATION_LIFETIME_DAYS * 24 * 3600 + 1);
    const looked = await lookup(token);
    expect(looked.status).toBe(410);
    expect(looked.body.code).toBe('invitation_expired');
    const accept = await browserAgent(context).post('/v1/invitations/accept').send({ token, displayName: 'Too Late', password: NEW_PASSWORD });
    expect(accept.body.code).toBe('invitation_expired');

    const owner = browserAgent(context);
    expect((await owner.post('/v1/auth/sign-in').send({ email: org.owner.email, password: org.owner.password })).status).toBe(200);
    const listed = (await owner.get('/v1/invitations')).body.data as Invitation[];
    expect(listed.find((invitation) => invitation.id === created.id)?.status).toBe('expired');

    // An expired address can be invited afresh: the new invitation replaces the old one.
    expect((await invite(owner, other, 'analyst')).role).toBe('analyst');

    before = lastOutboxId(context);
    const resent = await owner.post(`/v1/invitations/${created.id}/resend`);
    expect(resent.status).toBe(200);
    expect(resent.body.status).toBe('pending');
    expect(new Date(resent.body.expiresAt).getTime() - clock.now().getTime()).toBe(INVITATION_LIFETIME_DAYS * DAY_MS);
    const freshToken = await invitationTokenFor(context, email, before);
    expect((await lookup(token)).status).toBe(404);
    const joined = await browserAgent(context).post('/v1/invitations/accept').send({ token: freshToken, displayName: 'On Time', password: NEW_PASSWORD });
    expect(joined.status).toBe(200);
    expect(joined.body.activeOrganisation.role).toBe('analyst');
  });
});
