import { z } from 'zod';

/**
 * A site as the API lists it. Kept apart from the asset inputs in assets.ts, with their messages and
 * checks: the web app's pages that only list sites (the board's site filter) then load and build this
 * one schema, not every datasheet form's.
 */
export const siteSchema = z.object({
  id: z.number(),
  name: z.string(),
  code: z.string(),
  address: z.string(),
  timeZone: z.string(),
  lowestAmbientC: z.number(),
  highestAmbientC: z.number(),
  designIrradianceWm2: z.number(),
  peakSunHours: z.number(),
  ownerContactEmail: z.string(),
  ownerUserIds: z.array(z.number()),
  isArchived: z.boolean(),
  inverterCount: z.number(),
  stringCount: z.number(),
  sizingFailCount: z.number(),
});
export type Site = z.infer<typeof siteSchema>;
