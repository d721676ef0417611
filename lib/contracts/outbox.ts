import { z } from 'zod';

export const outboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.string(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  text: z.string(),
  hasHtml: z.boolean(),
  links: z.array(z.string()),
});
export const outboxResponseSchema = z.object({ messages: z.array(outboxMessageSchema) });
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
