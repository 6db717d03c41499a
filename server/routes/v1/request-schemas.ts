import { z } from 'zod';

/** Query and body schemas of the v1 routes (the test-run document lives in server/schemas). */
const isoWithOffset = z.iso.datetime({ offset: true, error: 'must be an ISO 8601 date-time with an offset' });

export const motorListQuerySchema = z.strictObject({
  product: z.string().min(1).max(32).optional(),
  lot: z.string().min(1).max(64).optional(),
  status: z.enum(['passed', 'failed', 'on hold', 'not tested']).optional(),
  station: z.string().min(1).max(32).optional(),
  from: isoWithOffset.optional(),
  to: isoWithOffset.optional(),
  serialPrefix: z.string().min(1).max(64).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  cursor: z.string().min(1).max(500).optional(),
  sort: z.enum(['serial', 'lastTestedAt']).default('serial'),
  order: z.enum(['asc', 'desc']).default('asc'),
}).meta({ id: 'MotorListQuery' });

export const lotListQuerySchema = z.strictObject({
  product: z.string().min(1).max(32).optional(),
  limit: z.coerce.number().int().min(1).max(500).default(50),
  cursor: z.string().min(1).max(100).optional(),
}).meta({ id: 'LotListQuery' });

export const testPlanQuerySchema = z.strictObject({
  at: isoWithOffset.optional().describe('the moment whose limits are wanted; now when omitted'),
}).meta({ id: 'TestPlanQuery' });

export const reasonBodySchema = z.strictObject({
  reason: z.string().trim().min(3, 'say why, in at least 3 characters').max(1000),
}).meta({ id: 'ReasonBody' });

export const reworkNoteBodySchema = z.strictObject({
  action: z.enum(['rework', 'retest']),
  note: z.string().trim().min(3, 'say what was done or why, in at least 3 characters').max(2000),
}).meta({ id: 'ReworkNoteBody' });

export const holdIdParamSchema = z.coerce.number().int().min(1, 'must be a hold id');
