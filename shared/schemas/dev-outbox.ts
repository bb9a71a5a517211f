import { z } from 'zod';
import { timestampSchema } from './common';

const outboxMessageIdSchema = z.string().regex(/^[1-9][0-9]{0,9}$/).meta({ description: 'Sequential id within the outbox.', example: '3' });

export const outboxMessageSummarySchema = z
  .object({
    id: outboxMessageIdSchema,
    receivedAt: timestampSchema,
    from: z.array(z.string()).meta({ example: ['Sweepline <no-reply@sweepline.example>'] }),
    to: z.array(z.string()).meta({ description: 'Envelope recipients (what was really delivered).', example: ['new.analyst@kestrelbay.example'] }),
    subject: z.string().meta({ example: 'You are invited to join Kestrel Bay Acoustics on Sweepline' }),
  })
  .meta({ id: 'OutboxMessageSummary' });
export type OutboxMessageSummary = z.infer<typeof outboxMessageSummarySchema>;

export const outboxMessageListSchema = z
  .object({ data: z.array(outboxMessageSummarySchema) })
  .meta({ id: 'OutboxMessageList', description: 'Messages the local mail catcher holds, newest first.' });
export type OutboxMessageList = z.infer<typeof outboxMessageListSchema>;

export const outboxMessageSchema = outboxMessageSummarySchema
  .extend({
    text: z.string().nullable().meta({ description: 'The plain-text part.' }),
    links: z.array(z.string()).meta({ description: 'Every http(s) link in the text part, in order (e.g. an invitation link).' }),
  })
  .meta({ id: 'OutboxMessage', description: 'One caught message with its text and links. The HTML part is not served.' });
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;

export const outboxMessageParamsSchema = z.strictObject({ messageId: outboxMessageIdSchema });
