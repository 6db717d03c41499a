import type { Knex } from 'knex';
import { notFound } from '../../errors.js';

export type Subscriber = { subject: string; email: string };

async function productIdOf(db: Knex, productCode: string): Promise<number> {
  const product = await db('products').where({ code: productCode }).first('id');
  if (!product) throw notFound(`No product ${productCode}.`);
  return product.id;
}

/** Subscribes a quality engineer to a product's signals; subscribing twice keeps one row. */
export async function subscribeToProduct(db: Knex, input: { subject: string; email: string; productCode: string }, now = new Date()): Promise<void> {
  const productId = await productIdOf(db, input.productCode);
  await db('signal_subscriptions')
    .insert({ subject: input.subject, email: input.email, product_id: productId, created_at: now })
    .onConflict(['subject', 'product_id'])
    .merge(['email']);
}

export async function unsubscribeFromProduct(db: Knex, input: { subject: string; productCode: string }): Promise<void> {
  const productId = await productIdOf(db, input.productCode);
  await db('signal_subscriptions').where({ subject: input.subject, product_id: productId }).delete();
}

export async function subscriptionsOf(db: Knex, subject: string): Promise<string[]> {
  const rows = await db('signal_subscriptions').join('products', 'products.id', 'signal_subscriptions.product_id')
    .where({ subject }).orderBy('products.code').select('products.code');
  return rows.map((row: { code: string }) => row.code);
}

export async function subscribersOf(db: Knex, productId: number): Promise<Subscriber[]> {
  return db('signal_subscriptions').where({ product_id: productId }).orderBy('id').select('subject', 'email');
}
