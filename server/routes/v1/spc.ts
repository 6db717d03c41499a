import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser, requirePermission } from '../../auth/principal.js';
import { selectableRules, chartKinds } from '../../services/spc/chart-kinds.js';
import { chartView } from '../../services/spc/chart-view.js';
import { capabilityView } from '../../services/spc/capability-view.js';
import { lotSubgroups } from '../../services/spc/subgroup-chart.js';
import { computeTrialLimits } from '../../services/spc/compute-trial-limits.js';
import { excludeBaselinePoint } from '../../services/spc/exclude-baseline-point.js';
import { freezeControlLimits } from '../../services/spc/freeze-control-limits.js';
import { spcCharacteristics } from '../../services/spc/list-characteristics.js';
import { ruleChoices } from '../../services/spc/describe-signal-rule.js';
import { param } from './param.js';

const id = z.coerce.number().int().positive();
const windowQuery = z.object({ from: z.iso.datetime({ offset: true }).optional(), to: z.iso.datetime({ offset: true }).optional() });
const asWindow = (q: z.infer<typeof windowQuery>) => ({ from: q.from ? new Date(q.from) : undefined, to: q.to ? new Date(q.to) : undefined });

const trialBody = z.strictObject({
  chartKind: z.enum(chartKinds),
  subgroupSize: z.number().int().min(2).max(25).optional(),
  from: z.iso.datetime({ offset: true }).optional(),
  to: z.iso.datetime({ offset: true }).optional(),
  rules: z.array(z.enum(selectableRules as [string, ...string[]])).optional(),
  params: z.strictObject({
    lambda: z.number().gt(0).max(1).optional(), L: z.number().positive().optional(),
    k: z.number().min(0).optional(), h: z.number().positive().optional(),
  }).optional(),
});
const exclusionBody = z.strictObject({
  runId: z.number().int().positive().optional(),
  lotId: z.number().int().positive().optional(),
  reason: z.string().trim().min(3, 'say what the assignable cause was').max(1000),
});

/** Control charts: reading for spc:read, Phase I limits and the freeze for spc:manage. */
export function spcRouter(db: Knex) {
  const router = Router();
  router.get('/characteristics', requirePermission('spc:read'), async (req, res) => {
    res.json(await spcCharacteristics(db, z.object({ product: z.string().optional() }).parse(req.query).product));
  });
  router.get('/rules', requirePermission('spc:read'), (_req, res) => {
    res.json(ruleChoices());
  });
  router.get('/characteristics/:id/chart', requirePermission('spc:read', { scopes: ['records:read'] }), async (req, res) => {
    res.json(await chartView(db, id.parse(param(req, 'id')), asWindow(windowQuery.parse(req.query))));
  });
  router.get('/characteristics/:id/subgroups', requirePermission('spc:read'), async (req, res) => {
    res.json({ lots: await lotSubgroups(db, id.parse(param(req, 'id')), asWindow(windowQuery.parse(req.query))) });
  });
  router.get('/characteristics/:id/capability', requirePermission('spc:read'), async (req, res) => {
    res.json(await capabilityView(db, id.parse(param(req, 'id')), asWindow(windowQuery.parse(req.query))));
  });
  router.post('/characteristics/:id/trial-limits', requirePermission('spc:manage'), async (req, res) => {
    const body = trialBody.parse(req.body);
    const input = { ...body, from: body.from ? new Date(body.from) : undefined, to: body.to ? new Date(body.to) : undefined, rules: body.rules as typeof selectableRules[number][] | undefined };
    res.status(201).json(await computeTrialLimits(db, currentUser(req.principal), id.parse(param(req, 'id')), input));
  });
  router.post('/control-limits/:id/exclusions', requirePermission('spc:manage'), async (req, res) => {
    res.status(201).json(await excludeBaselinePoint(db, currentUser(req.principal), id.parse(param(req, 'id')), exclusionBody.parse(req.body)));
  });
  router.post('/control-limits/:id/freeze', requirePermission('spc:manage'), async (req, res) => {
    res.json(await freezeControlLimits(db, currentUser(req.principal), id.parse(param(req, 'id'))));
  });
  return router;
}
