import { ErrorNote } from '../../../components/ErrorNote';
import { useCan } from '../../auth/use-can';
import { useSubscriptions } from '../api/get-subscriptions';
import { useSetSubscription } from '../api/set-subscription';

/**
 * E-mail for new signals of the product the inbox is filtered to, for those who answer signals.
 * Without a product filter there is nothing to subscribe to, and the control says so.
 */
export function SubscriptionToggle({ product }: { product: string | undefined }) {
  const canAct = useCan('signals:act');
  const { data, error } = useSubscriptions(canAct);
  const change = useSetSubscription();
  if (!canAct) return null;
  if (!product) return <p className="text-sm text-graphite-500">Filter by a product to subscribe to e-mail for its signals.</p>;
  const subscribed = data?.products.includes(product) ?? false;
  return (
    <div className="text-sm">
      <label className="inline-flex items-center gap-2">
        <input type="checkbox" role="switch" aria-checked={subscribed} checked={subscribed} disabled={!data || change.isPending}
          onChange={(e) => change.mutate({ product, subscribed: e.target.checked })} />
        Subscribe to e-mail for this product ({product})
      </label>
      {subscribed ? <p className="text-graphite-500">Each new signal of {product} is mailed to you with a link to it.</p> : null}
      {error ? <ErrorNote error={error} title="Could not load your subscriptions" /> : null}
      {change.error ? <ErrorNote error={change.error} title="Subscription not changed" /> : null}
    </div>
  );
}
