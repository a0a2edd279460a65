import { z } from 'zod';

export const gateCodes = ['AFTER_CHECK_PASS', 'AFTER_PHOTO', 'DIODE_RECORDS_COMPLETE', 'INSULATION_RECORDED', 'NO_PENDING_OFFLINE_ITEMS'] as const;
export type GateCode = (typeof gateCodes)[number];

export const gateSchema = z.object({
  code: z.enum(gateCodes),
  label: z.string(),
  ok: z.boolean(),
  /** What is missing, one line each, with a link target in the web app where it can be fixed. */
  missing: z.array(z.object({ message: z.string(), stringId: z.number().nullable(), overridable: z.boolean() })),
});
export type Gate = z.infer<typeof gateSchema>;
export const gatesResponseSchema = z.object({ ok: z.boolean(), gates: z.array(gateSchema) });
export type GatesResponse = z.infer<typeof gatesResponseSchema>;

/** Supervisor overrides are only for strings whose after-check did not pass, with a reason of 20+ characters. */
export const signOffInputSchema = z.object({
  version: z.number({ error: 'Send the version you last saw' }).int().min(0),
  comment: z.string().trim().max(2000, 'Use at most 2,000 characters').default(''),
  overrides: z
    .array(
      z.object({
        stringId: z.number().int().positive(),
        reason: z.string().trim().min(20, 'Explain the override in at least 20 characters').max(2000),
      }),
    )
    .max(500)
    .default([]),
});
export type SignOffInput = z.infer<typeof signOffInputSchema>;

export const signOffRecordSchema = z.object({
  workOrderId: z.number(),
  supervisor: z.object({ id: z.number(), name: z.string() }),
  signedAt: z.string(),
  comment: z.string(),
  digest: z.string(),
  overrides: z.array(z.object({ stringId: z.number(), stringLabel: z.string(), reason: z.string() })),
});
export type SignOffRecord = z.infer<typeof signOffRecordSchema>;

export const verifyResponseSchema = z.object({ matches: z.boolean(), storedDigest: z.string(), computedDigest: z.string(), checkedAt: z.string() });
export type VerifyResponse = z.infer<typeof verifyResponseSchema>;

export const offlineQueueReportSchema = z.object({ pending: z.number().int().min(0).max(10_000) });
