import { Router } from 'express';
import type { Knex } from 'knex';
import { currentUser, requirePermission } from '../../../auth/principal.js';
import { pathParam } from './path-param.js';
import {
  characteristicCreateSchema, characteristicUpdateSchema, productCreateSchema, productUpdateSchema,
} from '../../../schemas/setup.js';
import {
  createCharacteristic, createProduct, getProduct, listCharacteristics, listProducts,
  productHipotVoltage, updateCharacteristic, updateProduct,
} from '../../../services/setup/index.js';

/** /api/v1/setup/products: products, their characteristics and the standard hipot voltage. */
export function productsRouter(db: Knex) {
  const router = Router();
  const read = requirePermission('setup:read');
  const manage = requirePermission('products:manage');

  router.get('/', read, async (_req, res) => {
    res.json({ products: await listProducts(db) });
  });
  router.post('/', manage, async (req, res) => {
    const input = productCreateSchema.parse(req.body);
    res.status(201).json({ product: await createProduct(db, currentUser(req.principal), input) });
  });
  router.get('/:code', read, async (req, res) => {
    const [product, characteristics] = await Promise.all([getProduct(db, pathParam(req, 'code')), listCharacteristics(db, pathParam(req, 'code'))]);
    res.json({ product, characteristics });
  });
  router.put('/:code', manage, async (req, res) => {
    const input = productUpdateSchema.parse(req.body);
    res.json({ product: await updateProduct(db, currentUser(req.principal), pathParam(req, 'code'), input) });
  });
  router.get('/:code/hipot', read, async (req, res) => {
    res.json({ hipot: await productHipotVoltage(db, pathParam(req, 'code')) });
  });
  router.get('/:code/characteristics', read, async (req, res) => {
    res.json({ characteristics: await listCharacteristics(db, pathParam(req, 'code')) });
  });
  router.post('/:code/characteristics', manage, async (req, res) => {
    const input = characteristicCreateSchema.parse(req.body);
    res.status(201).json({ characteristic: await createCharacteristic(db, currentUser(req.principal), pathParam(req, 'code'), input) });
  });
  router.put('/:code/characteristics/:characteristic', manage, async (req, res) => {
    const input = characteristicUpdateSchema.parse(req.body);
    const user = currentUser(req.principal);
    res.json({ characteristic: await updateCharacteristic(db, user, pathParam(req, 'code'), pathParam(req, 'characteristic'), input) });
  });
  return router;
}
