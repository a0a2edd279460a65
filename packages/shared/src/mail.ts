import { z } from 'zod';

/** A message captured by the local mail catcher, as listed. */
export const mailSummarySchema = z.object({
  id: z.string(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  receivedAt: z.string(),
});
export type MailSummary = z.infer<typeof mailSummarySchema>;

export const mailMessageSchema = mailSummarySchema.extend({
  text: z.string(),
  html: z.string().nullable(),
});
export type MailMessage = z.infer<typeof mailMessageSchema>;
