import { z } from 'zod';
import { defineRoute, type RouteSpec } from '../http/route-table.js';
import type { FakeSmtpServer } from '../mail/fake-smtp-server.js';
import { TimestampSchema } from './schemas.js';

const MailSchema = z.object({
  id: z.number().int(),
  receivedAt: TimestampSchema,
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
});

/** The fake SMTP server's mailbox, for development and tests only (mounted only while the fake runs). */
export function createMailboxRoutes(mailbox: FakeSmtpServer): RouteSpec[] {
  return [
    defineRoute({
      method: 'get',
      path: '/dev/mailbox',
      summary: 'Every message the local fake SMTP server received (development only; admins)',
      tag: 'Development',
      access: 'any-admin',
      sessionOnly: true,
      query: z.object({ to: z.string().optional().describe('Only messages to this address') }),
      responses: {
        200: { description: 'Messages, newest first', schema: z.object({ messages: z.array(MailSchema) }) },
      },
      handler({ query }, _req, res) {
        const wanted = query.to?.toLowerCase();
        const messages = mailbox
          .messages()
          .filter((m) => wanted === undefined || m.to.some((to) => to.toLowerCase() === wanted))
          .reverse();
        res.json({ messages });
      },
    }),
  ];
}
