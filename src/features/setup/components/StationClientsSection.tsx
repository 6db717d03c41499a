import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import type { z } from 'zod';
import { stationClientSchema } from '../../../../server/schemas/setup';
import { Button } from '../../../components/Button';
import { EmptyState } from '../../../components/EmptyState';
import { ErrorNote } from '../../../components/ErrorNote';
import { LoadingScreen } from '../../../components/Spinner';
import { useCan } from '../../auth/use-can';
import { useBindStationClient } from '../api/bind-station-client';
import { useStationClients } from '../api/get-station-clients';
import { useSetupStations } from '../api/get-stations';
import { useUnbindStationClient } from '../api/unbind-station-client';
import { Field, inputClass } from './form-parts';

type Values = z.input<typeof stationClientSchema>;

/** Which OAuth client id (from the identity provider) posts runs for which station. */
export function StationClientsSection() {
  const canManage = useCan('stations:manage');
  const clients = useStationClients();
  const stations = useSetupStations();
  const bind = useBindStationClient();
  const unbind = useUnbindStationClient();
  const { register, handleSubmit, reset, formState: { errors } } = useForm<Values, unknown, z.output<typeof stationClientSchema>>({
    resolver: zodResolver(stationClientSchema),
    defaultValues: { clientId: '', stationCode: '', reason: '' },
  });
  const onSubmit = handleSubmit(async (values) => { await bind.mutateAsync(values); reset(); });

  if (clients.isPending) return <LoadingScreen label="Loading station clients…" />;
  if (clients.isError) return <ErrorNote error={clients.error} title="Could not load the station clients" />;

  return (
    <div className="space-y-4">
      {clients.data.length === 0 ? <EmptyState title="No client bound yet">Bind each station's client id so its runs are attributed to it.</EmptyState> : (
        <table className="w-full text-left text-sm">
          <caption className="sr-only">Station API clients</caption>
          <thead className="border-b border-paper-300 text-xs uppercase tracking-wide text-graphite-500">
            <tr><th className="py-2">Client id</th><th>Station</th><th><span className="sr-only">Actions</span></th></tr>
          </thead>
          <tbody>
            {clients.data.map((c) => (
              <tr key={c.clientId} className="border-b border-paper-200">
                <td className="figures py-2">{c.clientId}</td>
                <td className="figures">{c.stationCode}</td>
                <td className="text-right">
                  {canManage ? <Button size="sm" variant="quiet" disabled={unbind.isPending} onClick={() => unbind.mutate(c.clientId)}>Unbind {c.clientId}</Button> : null}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {unbind.error ? <ErrorNote error={unbind.error} title="The client was not unbound" /> : null}
      {canManage ? (
        <form onSubmit={onSubmit} aria-label="Bind a station client" className="grid grid-cols-2 gap-3 rounded-md bg-paper-100 p-3 md:grid-cols-4">
          <Field id="client-id" label="Client id" error={errors.clientId}>
            <input id="client-id" className={`${inputClass} figures`} {...register('clientId')} />
          </Field>
          <Field id="client-station" label="Station" error={errors.stationCode}>
            <select id="client-station" className={inputClass} {...register('stationCode')}>
              <option value="">Choose…</option>
              {(stations.data ?? []).map((s) => <option key={s.code} value={s.code}>{s.code} — {s.name}</option>)}
            </select>
          </Field>
          <Field id="client-reason" label="Reason" error={errors.reason}>
            <input id="client-reason" className={inputClass} {...register('reason')} />
          </Field>
          <div className="flex items-end"><Button type="submit" size="sm" disabled={bind.isPending}>Bind client</Button></div>
          {bind.error ? <div className="col-span-2 md:col-span-4"><ErrorNote error={bind.error} title="The client was not bound" /></div> : null}
        </form>
      ) : null}
    </div>
  );
}
