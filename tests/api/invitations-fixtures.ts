import { expect } from 'vitest';
import type { Invitation } from '@shared/schemas/invitations';
import type { CaughtEmail } from '@server/fakes/smtp/outbox';
import { linksIn } from '@server/fakes/smtp/outbox-view';
import type { Agent } from '../support/actors';
import type { TestContext } from '../support/test-app';

export async function invite(agent: Agent, email: string, role: Invitation['role']): Promise<Invitation> {
  const response = await agent.post('/v1/invitations').send({ email, role });
  expect(response.status, JSON.stringify(response.body)).toBe(201);
  return response.body as Invitation;
}

/** The newest caught e-mail to `email` received after `afterId` (ids count up from "1"). */
export function caughtInvitationFor(context: TestContext, email: string, afterId = 0): Promise<CaughtEmail> {
  return context.deps.devOutbox!.waitFor((message) => message.envelope.rcptTo.includes(email) && Number(message.id) > afterId);
}

export function lastOutboxId(context: TestContext): number {
  const messages = context.deps.devOutbox!.list();
  return messages.length === 0 ? 0 : Number(messages[messages.length - 1]!.id);
}

/** The accept link of an invitation e-mail and the token in it. */
export function acceptLinkOf(context: TestContext, message: CaughtEmail): { link: string; token: string } {
  const prefix = `${context.origin}/invitations/`;
  const link = linksIn(message).find((candidate) => candidate.startsWith(prefix));
  expect(link, `no invitation link in:\n${message.text}`).toBeDefined();
  return { link: link!, token: link!.slice(prefix.length) };
}

export async function invitationTokenFor(context: TestContext, email: string, afterId = 0): Promise<string> {
  return acceptLinkOf(context, await caughtInvitationFor(context, email, afterId)).token;
}
