import { z } from 'zod';

const positive = (label: string, unit: string, max: number) =>
  z
    .number({ error: `${label} must be a number in ${unit}` })
    .finite()
    .gt(0, `${label} must be more than 0 ${unit}`)
    .max(max, `${label} can be at most ${max} ${unit}`);

/**
 * A module datasheet at STC, with temperature coefficients in %/°C (beta −0.29 means −0.29 %/°C).
 * Mirrors `ModuleSpec` of `@stringfield/pv`; the refinements give each field a message a person can act on.
 */
export const moduleSpecSchema = z
  .object({
    pmaxW: positive('Pmax', 'W', 1500),
    vocV: positive('Voc', 'V', 200),
    iscA: positive('Isc', 'A', 50),
    vmpV: positive('Vmp', 'V', 200),
    impA: positive('Imp', 'A', 50),
    alphaIscPctPerC: z
      .number({ error: 'Alpha (Isc) must be a number in %/°C' })
      .min(-0.2, 'Alpha (Isc) is usually between 0 and +0.1 %/°C')
      .max(0.2, 'Alpha (Isc) is usually between 0 and +0.1 %/°C'),
    betaVocPctPerC: z
      .number({ error: 'Beta (Voc) must be a number in %/°C' })
      .lt(0, 'Beta (Voc) of a crystalline module is negative, e.g. −0.29 %/°C')
      .min(-1, 'Beta (Voc) is usually between −0.2 and −0.4 %/°C'),
    gammaPmaxPctPerC: z
      .number({ error: 'Gamma (Pmax) must be a number in %/°C' })
      .lt(0, 'Gamma (Pmax) is negative, e.g. −0.35 %/°C')
      .min(-1, 'Gamma (Pmax) is usually between −0.25 and −0.5 %/°C'),
    cellsInSeries: z
      .number({ error: 'Cells in series must be a whole number' })
      .int('Cells in series must be a whole number')
      .min(1, 'A module has at least one cell in series')
      .max(200, 'At most 200 cells in series'),
    bypassDiodes: z
      .number({ error: 'Bypass diodes must be a whole number' })
      .int('Bypass diodes must be a whole number')
      .min(1, 'At least one bypass diode')
      .max(12, 'At most 12 bypass diodes'),
    noctC: z
      .number({ error: 'NOCT must be a number in °C' })
      .min(30, 'NOCT is usually 40–50 °C')
      .max(70, 'NOCT is usually 40–50 °C')
      .optional(),
  })
  .superRefine((m, ctx) => {
    if (m.vmpV >= m.vocV) ctx.addIssue({ code: 'custom', path: ['vmpV'], message: 'Vmp must be below Voc' });
    if (m.impA >= m.iscA) ctx.addIssue({ code: 'custom', path: ['impA'], message: 'Imp must be below Isc' });
    if (m.cellsInSeries % m.bypassDiodes !== 0)
      ctx.addIssue({
        code: 'custom',
        path: ['bypassDiodes'],
        message: `${m.cellsInSeries} cells do not split evenly over ${m.bypassDiodes} bypass diodes`,
      });
    const pmpFromPoint = m.vmpV * m.impA;
    if (Math.abs(pmpFromPoint - m.pmaxW) / m.pmaxW > 0.03)
      ctx.addIssue({
        code: 'custom',
        path: ['pmaxW'],
        message: `Pmax should be close to Vmp × Imp (${pmpFromPoint.toFixed(1)} W)`,
      });
  });
export type ModuleSpecInput = z.infer<typeof moduleSpecSchema>;
