import { outboxMessageListSchema, outboxMessageParamsSchema, outboxMessageSchema } from '@shared/schemas/dev-outbox';
import type { AppDeps } from '@server/deps';
import type { Outbox } from '@server/fakes/smtp/outbox';
import { toOutboxEntry } from '@server/fakes/smtp/outbox-view';
import { ApiProblem } from '@server/http/api-problem';
import { defineRoute } from '@server/http/define-route';

const AVAILABILITY =
  'Only while this server sends its e-mail to the local mail catcher (development and tests, never production); otherwise 404 not_found. ' +
  'The catcher is shared by the whole server, so it shows messages of every organisation.';

function outboxOf(deps: AppDeps): Outbox {
  if (!deps.devOutbox || deps.config.nodeEnv === 'production') {
    throw new ApiProblem('not_found', 'There is no development outbox: this server sends e-mail through a real mail relay, or none.');
  }
  return deps.devOutbox;
}

export const devOutboxRoutes = [
  defineRoute({
    method: 'get',
    path: '/dev/outbox',
    operationId: 'listOutboxMessages',
    summary: 'List caught e-mails (development)',
    description: `E-mails the local mail catcher took instead of delivering them, newest first. ${AVAILABILITY}`,
    tags: ['Development'],
    permission: 'members:manage',
    responses: { 200: { description: 'The caught messages.', schema: outboxMessageListSchema } },
    problems: ['not_found'],
    handler: async ({ deps }) => {
      const messages = outboxOf(deps).list().reverse().map(toOutboxEntry);
      return { status: 200, body: { data: messages.map(({ id, receivedAt, from, to, subject }) => ({ id, receivedAt, from, to, subject })) } };
    },
  }),
  defineRoute({
    method: 'get',
    path: '/dev/outbox/{messageId}',
    operationId: 'getOutboxMessage',
    summary: 'Read a caught e-mail (development)',
    description: `One caught message with its plain-text body and the links in it. ${AVAILABILITY}`,
    tags: ['Development'],
    permission: 'members:manage',
    request: { params: outboxMessageParamsSchema },
    responses: { 200: { description: 'The message.', schema: outboxMessageSchema } },
    problems: ['not_found'],
    handler: async ({ deps, params }) => {
      const email = outboxOf(deps).get(params.messageId);
      if (!email) throw new ApiProblem('not_found', 'No caught e-mail with this id (the catcher keeps the latest 200 until the server restarts).');
      const { id, receivedAt, from, to, subject, text, links } = toOutboxEntry(email);
      return { status: 200, body: { id, receivedAt, from, to, subject, text, links } };
    },
  }),
];
