import { Router } from 'express';
import type { Knex } from 'knex';
import { z } from 'zod';
import { currentUser, requirePermission } from '../../auth/principal.js';
import { listSignals } from '../../services/signals/list-signals.js';
import { getSignal } from '../../services/signals/get-signal.js';
import { acknowledgeSignal, assignSignal, assignableEngineers } from '../../services/signals/act-on-signal.js';
import { containSignal } from '../../services/signals/contain-signal.js';
import { closeSignal } from '../../services/signals/close-signal.js';
import { subscribeToProduct, subscriptionsOf, unsubscribeFromProduct } from '../../services/signals/subscriptions.js';
import { param } from './param.js';

const id = z.coerce.number().int().positive();
const listQuery = z.object({
  status: z.enum(['open', 'acknowledged', 'contained', 'closed']).optional(),
  product: z.string().trim().min(1).max(32).optional(),
  characteristicId: z.coerce.number().int().positive().optional(),
});
const text = (what: string) => z.string().trim().min(3, `say ${what}`).max(2000);
const closeBody = z.strictObject({ cause: text('what caused it'), actionTaken: text('what was done'), outcome: z.enum(['released', 'scrapped', 'reworked']) });

/** Signals: read with signals:read; acknowledge, assign, contain and close with signals:act. */
export function signalsRouter(db: Knex) {
  const router = Router();
  router.get('/', requirePermission('signals:read'), async (req, res) => {
    res.json(await listSignals(db, listQuery.parse(req.query)));
  });
  router.get('/engineers', requirePermission('signals:read'), async (_req, res) => {
    res.json({ engineers: await assignableEngineers(db) });
  });
  router.get('/subscriptions', requirePermission('signals:act'), async (req, res) => {
    res.json({ products: await subscriptionsOf(db, currentUser(req.principal).subject) });
  });
  router.put('/subscriptions/:product', requirePermission('signals:act'), async (req, res) => {
    const user = currentUser(req.principal);
    await subscribeToProduct(db, { subject: user.subject, email: user.email, productCode: param(req, 'product') });
    res.json({ products: await subscriptionsOf(db, user.subject) });
  });
  router.delete('/subscriptions/:product', requirePermission('signals:act'), async (req, res) => {
    const user = currentUser(req.principal);
    await unsubscribeFromProduct(db, { subject: user.subject, productCode: param(req, 'product') });
    res.json({ products: await subscriptionsOf(db, user.subject) });
  });
  router.get('/:id', requirePermission('signals:read'), async (req, res) => {
    res.json(await getSignal(db, id.parse(param(req, 'id'))));
  });
  router.post('/:id/acknowledge', requirePermission('signals:act'), async (req, res) => {
    res.json(await acknowledgeSignal(db, currentUser(req.principal), id.parse(param(req, 'id'))));
  });
  router.post('/:id/assign', requirePermission('signals:act'), async (req, res) => {
    const { assignee } = z.strictObject({ assignee: z.string().min(1).max(255) }).parse(req.body);
    res.json(await assignSignal(db, currentUser(req.principal), id.parse(param(req, 'id')), assignee));
  });
  router.post('/:id/contain', requirePermission('signals:act'), async (req, res) => {
    const { note } = z.strictObject({ note: z.string().trim().max(1000).optional() }).parse(req.body ?? {});
    res.json(await containSignal(db, currentUser(req.principal), id.parse(param(req, 'id')), note || undefined));
  });
  router.post('/:id/close', requirePermission('signals:act'), async (req, res) => {
    res.json(await closeSignal(db, currentUser(req.principal), id.parse(param(req, 'id')), closeBody.parse(req.body)));
  });
  return router;
}
