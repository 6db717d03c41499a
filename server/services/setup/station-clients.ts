import type { Knex } from 'knex';
import type { SessionUser } from '../../auth/session.js';
import { invalid, notFound } from '../../errors.js';
import type { StationClientInput } from '../../schemas/setup.js';
import { recordAudit } from '../audit/record-audit.js';
import { actorOf, reasonOf } from './actor.js';
import type { StationRow } from './stations.js';
import { changeReferenceData } from './change-reference-data.js';

type Binding = { clientId: string; stationCode: string };

async function findBinding(db: Knex, clientId: string): Promise<Binding | undefined> {
  return db('station_clients').join('stations', 'stations.id', 'station_clients.station_id')
    .where('station_clients.client_id', clientId)
    .first<Binding | undefined>('station_clients.client_id as clientId', 'stations.code as stationCode');
}

/** Which OAuth client id posts runs for which station. */
export async function listStationClients(db: Knex): Promise<Binding[]> {
  return db('station_clients').join('stations', 'stations.id', 'station_clients.station_id')
    .orderBy('station_clients.client_id')
    .select<Binding[]>('station_clients.client_id as clientId', 'stations.code as stationCode');
}

/** Binds a client id to a station, moving it if it was bound elsewhere (the move is audited). */
export async function bindStationClient(db: Knex, user: SessionUser, input: StationClientInput, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const station = await trx<StationRow>('stations').where({ code: input.stationCode }).forUpdate().first();
    if (!station) throw invalid([{ field: 'stationCode', message: `No station with the code ${input.stationCode}` }]);
    const before = await findBinding(trx, input.clientId);
    if (before) await trx('station_clients').where({ client_id: input.clientId }).update({ station_id: station.id });
    else await trx('station_clients').insert({ client_id: input.clientId, station_id: station.id });
    const after: Binding = { clientId: input.clientId, stationCode: station.code };
    await recordAudit(trx, {
      actor: actorOf(user), action: 'station_client.bound', entityType: 'station_client', entityId: input.clientId,
      before: before ?? null, after, reason: reasonOf(input.reason), at: now,
    });
    return after;
  });
}

export async function unbindStationClient(db: Knex, user: SessionUser, clientId: string, reason: string | undefined, now = new Date()) {
  return changeReferenceData(db, async (trx) => {
    const before = await findBinding(trx, clientId);
    if (!before) throw notFound(`The client ${clientId} is not bound to any station.`);
    await trx('station_clients').where({ client_id: clientId }).delete();
    await recordAudit(trx, {
      actor: actorOf(user), action: 'station_client.unbound', entityType: 'station_client', entityId: clientId,
      before, reason: reasonOf(reason), at: now,
    });
    return before;
  });
}
