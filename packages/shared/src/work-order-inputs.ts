import { z } from 'zod';
import { faultCategorySchema, prioritySchema, workOrderSourceSchema } from './work-orders.ts';

// A new ticket, an edit and a comment as the forms send them, with a message for every field. Apart from
// work-orders.ts (the records, states and rules), which the board, the home page and the field page load
// at start-up.

export const createWorkOrderInputSchema = z.object({
  siteId: z.number({ error: 'Choose a site' }).int().positive(),
  strings: z
    .array(
      z.object({
        stringId: z.number().int().positive(),
        symptom: z.string().trim().max(500, 'Use at most 500 characters').default(''),
      }),
    )
    .min(1, 'Pick at least one string')
    .max(500, 'At most 500 strings per request'),
  /** One ticket for all strings, or one ticket per string (bulk). */
  mode: z.enum(['single', 'perString']).default('single'),
  faultCategory: faultCategorySchema,
  priority: prioritySchema,
  title: z.string({ error: 'Enter a title' }).trim().min(3, 'Use at least 3 characters').max(160, 'Use at most 160 characters'),
  description: z.string().trim().max(5000, 'Use at most 5,000 characters').default(''),
  source: workOrderSourceSchema,
  reportedAt: z.iso.datetime({ offset: true, error: 'Use an ISO date and time' }).optional(),
  assigneeId: z.number().int().positive().optional(),
});
export type CreateWorkOrderInput = z.infer<typeof createWorkOrderInputSchema>;

export const updateWorkOrderInputSchema = z.object({
  version: z.number({ error: 'Send the version you last saw' }).int().min(0),
  title: z.string().trim().min(3, 'Use at least 3 characters').max(160).optional(),
  description: z.string().trim().max(5000).optional(),
  priority: prioritySchema.optional(),
  faultCategory: faultCategorySchema.optional(),
  dueAt: z.iso.datetime({ offset: true, error: 'Use an ISO date and time' }).optional(),
});
export type UpdateWorkOrderInput = z.infer<typeof updateWorkOrderInputSchema>;

export const commentInputSchema = z.object({
  body: z.string({ error: 'Write a comment' }).trim().min(1, 'Write a comment').max(5000, 'Use at most 5,000 characters'),
});
