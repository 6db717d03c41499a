import type { Knex } from 'knex';

const stationTtlMs = 5_000;
const stationsByClient = new Map<string, { value: StationRef; expiresAtMs: number }>();

export function forgetStations(): void {
  stationsByClient.clear();
}

export type StationRef = { id: number; code: string; line: string; kind: string; name: string; calibrationDue: string };

const columns = ['stations.id', 'stations.code', 'stations.line', 'stations.kind', 'stations.name', 'stations.calibration_due'];

function toStation(row: { id: number; code: string; line: string; kind: string; name: string; calibration_due: Date }): StationRef {
  // DATE columns arrive as UTC midnight (the pool runs in UTC), so the ISO date part is the stored date.
  return { id: row.id, code: row.code, line: row.line, kind: row.kind, name: row.name, calibrationDue: row.calibration_due.toISOString().slice(0, 10) };
}

/** The station an OAuth2 client is bound to (station_clients), read fresh for its calibration date. */
export async function stationOfClient(db: Knex, clientId: string): Promise<StationRef | null> {
  const row = await db('station_clients').join('stations', 'stations.id', 'station_clients.station_id')
    .where('station_clients.client_id', clientId).first(columns);
  return row ? toStation(row) : null;
}

/**
 * The same, cached per process for a few seconds for ingest (stations post many runs a minute).
 * A new calibration date therefore reaches ingest within stationTtlMs; Setup changes in this
 * process call forgetReferenceData(), which clears this cache too.
 */
export async function cachedStationOfClient(db: Knex, clientId: string): Promise<StationRef | null> {
  const cached = stationsByClient.get(clientId);
  if (cached && cached.expiresAtMs > Date.now()) return cached.value;
  const value = await stationOfClient(db, clientId);
  if (value) stationsByClient.set(clientId, { value, expiresAtMs: Date.now() + stationTtlMs });
  return value;
}

export async function stationByCode(db: Knex, code: string): Promise<StationRef | null> {
  const row = await db('stations').where({ code }).first(columns);
  return row ? toStation(row) : null;
}
