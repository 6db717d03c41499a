import type { Knex } from 'knex';
import { bindStationClient, createStation, recordCalibration } from '../../server/services/setup/index.js';
import { demoActors } from './actors.js';
import type { DemoClock } from './clock.js';
import { calibrationIntervalDays, demoStationClients, demoStations } from './stations.js';

/** Stations with their calibration history and client bindings, through Setup's audited operations. */
export async function writeStations(db: Knex, clock: DemoClock): Promise<void> {
  for (const [index, station] of demoStations.entries()) {
    const [firstCalibration] = station.calibratedDaysAgo;
    await createStation(db, demoActors.admin, {
      code: station.code, line: station.line, kind: 'eol', name: station.name, active: true,
      calibrationDue: clock.day(firstCalibration), reason: `Line ${station.line} commissioning`,
    }, clock.at(firstCalibration + 1));
    for (const [n, daysAgo] of station.calibratedDaysAgo.entries()) {
      await recordCalibration(db, demoActors.admin, station.code, {
        calibratedOn: clock.day(daysAgo), due: clock.day(daysAgo - calibrationIntervalDays),
        certificate: `MCL-${4100 + index * 37 + n * 211}`, reason: 'Half-yearly calibration by the metrology lab',
      }, clock.at(daysAgo - 0.5));
    }
  }
  for (const binding of demoStationClients) {
    await bindStationClient(db, demoActors.admin, { ...binding, reason: 'Stand software installed' }, clock.at(60));
  }
}
