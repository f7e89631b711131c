import { z } from 'zod';

export const healthReply = z.object({ status: z.literal('ok'), uptimeS: z.number() });

export const readyReply = z.object({
  status: z.enum(['ready', 'not_ready']),
  database: z.object({ open: z.boolean(), migrationsApplied: z.boolean() }),
});
