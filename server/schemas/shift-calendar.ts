import { z } from 'zod';
import { isKnownTimeZone } from '../services/yield/plant-time.js';

// The plant shift calendar as Setup edits it; shared by the API and the Setup form.
const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, 'must be HH:MM from 00:00 to 23:59, e.g. 06:00');

export const shiftCalendarBodySchema = z.strictObject({
  timeZone: z.string().trim().min(1).max(64).refine(isKnownTimeZone, 'must be an IANA time zone such as Europe/Berlin or UTC'),
  firstPassTarget: z.number().gt(0, 'must be above 0').max(1, 'must be at most 1 (100 %)'),
  shifts: z.array(z.strictObject({
    code: z.string().trim().regex(/^[a-z0-9-]{1,16}$/, 'must be 1–16 lower-case letters, digits or dashes'),
    name: z.string().trim().min(1).max(64),
    startsAt: clock,
  })).min(1, 'give at least one shift').max(6, 'give at most six shifts'),
  reason: z.string().trim().min(3, 'say why, in at least 3 characters').max(1000),
}).meta({ id: 'ShiftCalendarBody' });
export type ShiftCalendarBody = z.infer<typeof shiftCalendarBodySchema>;
