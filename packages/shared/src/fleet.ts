import { z } from 'zod';
import { faultCategorySchema, workOrderStatusSchema } from './work-orders.ts';

export const healthCellSchema = z.object({
  stringId: z.number(),
  label: z.string(),
  inverterTag: z.string(),
  mpptInput: z.number(),
  combinerTag: z.string().nullable(),
  combinerPosition: z.number().nullable(),
  verdict: z.enum(['pass', 'attention', 'fail']).nullable(),
  vocDeviationPct: z.number().nullable(),
  iscDeviationPct: z.number().nullable(),
  checkedAt: z.string().nullable(),
  openTickets: z.number(),
});
export type HealthCell = z.infer<typeof healthCellSchema>;
export const healthMapSchema = z.object({
  siteId: z.number(),
  cells: z.array(healthCellSchema),
  counts: z.object({ pass: z.number(), attention: z.number(), fail: z.number(), unchecked: z.number(), withOpenTickets: z.number() }),
});
export type HealthMap = z.infer<typeof healthMapSchema>;

export const energyAtRiskItemSchema = z.object({
  workOrderId: z.number(),
  number: z.string(),
  siteCode: z.string(),
  missingW: z.number(),
  dailyKWh: z.number(),
  peakSunHours: z.number(),
  basis: z.string(),
});
export type EnergyAtRiskItem = z.infer<typeof energyAtRiskItemSchema>;

export const metricsQuerySchema = z
  .object({
    siteId: z.coerce.number().int().positive().optional(),
    faultCategory: faultCategorySchema.optional(),
    from: z.iso.date({ error: 'from: use a date like 2026-09-01' }),
    to: z.iso.date({ error: 'to: use a date like 2026-11-30' }),
  })
  .refine((q) => q.from <= q.to, { path: ['to'], message: '"to" must not be before "from"' });
export type MetricsQuery = z.infer<typeof metricsQuerySchema>;

export const metricsSchema = z.object({
  period: z.object({ from: z.string(), to: z.string() }),
  openByStatus: z.array(z.object({ status: workOrderStatusSchema, count: z.number(), averageAgeHours: z.number() })),
  overdueCount: z.number(),
  meanTimes: z.array(
    z.object({
      siteId: z.number(),
      siteCode: z.string(),
      faultCategory: faultCategorySchema,
      tickets: z.number(),
      toDispatchHours: z.number().nullable(),
      toRepairHours: z.number().nullable(),
      toSignOffHours: z.number().nullable(),
    }),
  ),
  firstTimeFix: z.object({ signedOff: z.number(), withoutReturn: z.number(), rate: z.number().nullable() }),
  repeatFaults: z.array(z.object({ stringId: z.number(), label: z.string(), siteCode: z.string(), repeats: z.number() })),
  topFaultCategories: z.array(z.object({ faultCategory: faultCategorySchema, count: z.number() })),
});
export type Metrics = z.infer<typeof metricsSchema>;

export const exportQuerySchema = z
  .object({
    siteId: z.coerce.number({ error: 'Choose a site' }).int().positive(),
    from: z.iso.date({ error: 'from: use a date like 2026-09-01' }),
    to: z.iso.date({ error: 'to: use a date like 2026-11-30' }),
  })
  .refine((q) => q.from <= q.to, { path: ['to'], message: '"to" must not be before "from"' });
