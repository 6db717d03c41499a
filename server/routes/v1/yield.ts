import { Router, type RequestHandler } from 'express';
import type { Knex } from 'knex';
import { requirePermission } from '../../auth/principal.js';
import { getYield } from '../../services/yield/get-yield.js';
import { getYieldHeadline } from '../../services/yield/get-yield-headline.js';
import { listYieldMotors, yieldMotorsQuerySchema } from '../../services/yield/list-yield-motors.js';
import { changeShiftCalendar, presentCalendar, shiftCalendarBodySchema } from '../../services/yield/change-shift-calendar.js';
import { readShiftCalendar } from '../../services/yield/shift-calendar.js';
import { yieldFilterFields, yieldQuerySchema } from '../../services/yield/yield-filter.js';
import { z } from 'zod';
import { actorOf } from './actor.js';

const mayReadYield = requirePermission('yield:read', { scopes: ['records:read'] });
const headlineQuerySchema = z.strictObject({ product: yieldFilterFields.product, line: yieldFilterFields.line });

/** The calendar is read by the board (yield:read) and by Setup (setup:read). */
const mayReadCalendar: RequestHandler = (req, res, next) => {
  const principal = req.principal;
  const action = principal?.kind === 'user' && principal.permissions.includes('setup:read') ? 'setup:read' : 'yield:read';
  requirePermission(action, { scopes: ['records:read'] })(req, res, next);
};

/** Yield board API: yields and Pareto, headline tiles, drill-down motors and the shift calendar. */
export function yieldRouter(db: Knex) {
  const router = Router();
  router.get('/', mayReadYield, async (req, res) => {
    res.json(await getYield(db, yieldQuerySchema.parse(req.query)));
  });
  router.get('/headline', mayReadYield, async (req, res) => {
    res.json(await getYieldHeadline(db, headlineQuerySchema.parse(req.query)));
  });
  router.get('/motors', mayReadYield, async (req, res) => {
    res.json(await listYieldMotors(db, yieldMotorsQuerySchema.parse(req.query)));
  });
  router.get('/shift-calendar', mayReadCalendar, async (_req, res) => {
    res.json(presentCalendar(await readShiftCalendar(db)));
  });
  // Shifts are plant operation, set up by whoever runs the stations.
  router.put('/shift-calendar', requirePermission('stations:manage'), async (req, res) => {
    res.json(await changeShiftCalendar(db, shiftCalendarBodySchema.parse(req.body), actorOf(req)));
  });
  return router;
}
