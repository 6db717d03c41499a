// Plant records for the audit, evidence-pack and where-used tests, inserted directly (the shared
// factories were not there yet). Everything is invented. Badges include formula-injection attempts.
import request from 'supertest';
import { randomUUID } from 'node:crypto';
import type { Knex } from 'knex';
import { signIn } from '../support/sign-in.js';
import { recordAudit } from '../../server/services/audit/record-audit.js';

export type Agent = { get(path: string): request.Test; post(path: string, body?: object): request.Test };

/** A signed-in caller whose writes carry the CSRF header, as the browser client's do. */
export async function signedIn(appUrl: string, login: string): Promise<Agent> {
  const { cookie } = await signIn(appUrl, login);
  if (!cookie) throw new Error(`sign-in as ${login} gave no session cookie`);
  return {
    get: (path) => request(appUrl).get(path).set('cookie', cookie),
    post: (path, body = {}) => request(appUrl).post(path).set('cookie', cookie).set('x-fluxtrail-csrf', '1').send(body),
  };
}

/** A release reason with characters a worksheet cannot hold as they are (XML 1.0 §2.2): BEL, CR, U+FFFF, and a literal escape. */
export const controlCharacterReason = 'Retested quietly\u0007 (bell)\r\nsee _x0041_ in the log\uFFFF';
export const injectionBadges = ['=HYPERLINK("http://attacker.invalid","open")', '+1', '-2', '@SUM(A1:A9)'];

const t0 = Date.UTC(2026, 10, 3, 6, 0, 0);
const at = (minutes: number) => new Date(t0 + minutes * 60_000);

async function product(db: Knex, code: string, kind: 'pmsm' | 'dc', characteristics: Array<[string, string, number, number]>) {
  const [id] = await db('products').insert({
    code, name: `Invented motor ${code}`, motor_kind: kind, pole_pairs: 4, rated_voltage_v: 400, rated_power_kw: 20,
    rated_speed_rpm: 4000, winding_material: 'copper', insulation_class: 'H', serial_pattern: '.*', created_at: at(-9000),
  });
  const chars: Array<{ id: number; code: string; lsl: number; usl: number }> = [];
  for (const [index, [cCode, unit, lsl, usl]] of characteristics.entries()) {
    const [cid] = await db('characteristics').insert({ product_id: id, code: cCode, name: cCode, unit, test_step: 'eol', sort_order: index });
    chars.push({ id: Number(cid), code: cCode, lsl, usl });
  }
  return { id: Number(id), code, chars };
}

async function limitSet(db: Knex, p: { id: number; chars: Array<{ id: number; lsl: number; usl: number }> }, revision: number) {
  const [id] = await db('limit_sets').insert({
    product_id: p.id, revision, status: 'approved', effective_from: at(-5000 + revision), authored_by: 'sub-q', authored_by_name: 'Quinn Author',
    authored_at: at(-6000 + revision), approved_by: 'sub-a', approved_by_name: 'Avery Approver', approved_at: at(-5500 + revision),
  });
  for (const c of p.chars) await db('limits').insert({ limit_set_id: id, characteristic_id: c.id, lsl: c.lsl, nominal: (c.lsl + c.usl) / 2, usl: c.usl });
  return { id: Number(id), revision };
}

export type Seeded = Awaited<ReturnType<typeof seedPlant>>;

/**
 * Two products, three lots (two share stator lot ST-77), eight motors, nine runs (PM150-0002
 * failed once and was retested), a released motor hold and an open lot hold, and audit events.
 */
export async function seedPlant(db: Knex) {
  const pm = await product(db, 'PM-150', 'pmsm', [['bemf.ke', 'V/krpm', 20, 30], ['ins.r500', 'MΩ', 100, 100_000], ['res.offset', 'deg', -2, 2]]);
  const dc = await product(db, 'DC-40', 'dc', [['noload.speed', 'rpm', 2900, 3100], ['wr.r20', 'Ω', 0.5, 0.9]]);
  const pmRev1 = await limitSet(db, pm, 1);
  const pmRev2 = await limitSet(db, pm, 2);
  const dcRev1 = await limitSet(db, dc, 1);
  const stations: Record<string, number> = {};
  for (const code of ['EOL-1', 'EOL-2']) {
    const [id] = await db('stations').insert({ code, line: 'L1', kind: 'eol', name: `End-of-line stand ${code}`, calibration_due: '2027-03-01' });
    stations[code] = Number(id);
    await db('station_calibrations').insert([
      { station_id: id, calibrated_on: '2026-03-01', due: '2026-09-01', certificate: `CAL-${code}-1`, recorded_by: 'Ada Admin', recorded_at: at(-9000) },
      { station_id: id, calibrated_on: '2026-09-01', due: '2027-03-01', certificate: `CAL-${code}-2`, recorded_by: 'Ada Admin', recorded_at: at(-3000) },
    ]);
  }
  const lots: Record<string, number> = {};
  for (const [code, productId, components] of [
    ['LOT-A', pm.id, [['stator', 'ST-77'], ['magnet', 'MG-5']]],
    ['LOT-B', pm.id, [['stator', 'ST-77']]],
    ['LOT-C', dc.id, [['rotor', 'RT-9']]],
  ] as const) {
    const [id] = await db('lots').insert({ code, product_id: productId, created_at: at(-100) });
    lots[code] = Number(id);
    for (const [kind, supplierLot] of components) await db('lot_components').insert({ lot_id: id, component_kind: kind, supplier_lot_code: supplierLot, supplier: 'Invented Supplier GmbH' });
  }
  const motors: Record<string, number> = {};
  const plan: Array<{ serial: string; lot: string; product: typeof pm; attempts: Array<{ station: string; badge: string; fail?: boolean; rev: { id: number; revision: number } }> }> = [
    { serial: 'PM150-0001', lot: 'LOT-A', product: pm, attempts: [{ station: 'EOL-1', badge: injectionBadges[0], rev: pmRev1 }] },
    { serial: 'PM150-0002', lot: 'LOT-A', product: pm, attempts: [{ station: 'EOL-1', badge: injectionBadges[1], fail: true, rev: pmRev1 }, { station: 'EOL-2', badge: injectionBadges[2], rev: pmRev2 }] },
    { serial: 'PM150-0003', lot: 'LOT-A', product: pm, attempts: [{ station: 'EOL-2', badge: injectionBadges[3], rev: pmRev2 }] },
    { serial: 'PM150-0004', lot: 'LOT-A', product: pm, attempts: [{ station: 'EOL-2', badge: 'B-1004', rev: pmRev2 }] },
    { serial: 'PM150-0005', lot: 'LOT-B', product: pm, attempts: [{ station: 'EOL-1', badge: 'B-1005', rev: pmRev2 }] },
    { serial: 'PM150-0006', lot: 'LOT-B', product: pm, attempts: [{ station: 'EOL-1', badge: 'B-1006', rev: pmRev2 }] },
    { serial: 'DC40-0001', lot: 'LOT-C', product: dc, attempts: [{ station: 'EOL-2', badge: 'B-2001', rev: dcRev1 }] },
    { serial: 'DC40-0002', lot: 'LOT-C', product: dc, attempts: [{ station: 'EOL-2', badge: 'B-2002', fail: true, rev: dcRev1 }] },
  ];
  let minute = 0;
  for (const [motorIndex, m] of plan.entries()) {
    const last = m.attempts[m.attempts.length - 1];
    const status = m.lot === 'LOT-B' ? 'on hold' : last.fail ? 'failed' : 'passed';
    const [motorId] = await db('motors').insert({ serial: m.serial, product_id: m.product.id, lot_id: lots[m.lot], status, attempts: m.attempts.length, created_at: at(-50 + motorIndex) });
    motors[m.serial] = Number(motorId);
    for (const [attemptIndex, a] of m.attempts.entries()) {
      minute += 7;
      const [runId] = await db('test_runs').insert({
        run_uuid: randomUUID(), motor_id: motorId, station_id: stations[a.station], lot_id: lots[m.lot], attempt: attemptIndex + 1,
        started_at: at(minute), finished_at: at(minute + 2), operator_badge: a.badge, program_version: 'EOL-PRG 3.2.1',
        limit_set_id: a.rev.id, verdict: a.fail ? 'fail' : 'pass', calibration_ok: true, calibration_due: '2027-03-01',
        body_sha256: 'ab'.repeat(32), response_json: '{}', received_at: at(minute + 2),
      });
      for (const [ci, c] of m.product.chars.entries()) {
        const value = a.fail && ci === 0 ? c.usl + 1 : c.lsl + (c.usl - c.lsl) * (0.3 + 0.05 * motorIndex + 0.01 * ci);
        await db('measurements').insert({ run_id: runId, characteristic_id: c.id, value, lsl: c.lsl, usl: c.usl, verdict: a.fail && ci === 0 ? 'fail' : 'pass' });
      }
      await db('motors').where({ id: motorId }).update({ latest_run_id: runId, last_station_id: stations[a.station], last_tested_at: at(minute) });
    }
  }
  await db('holds').insert([
    { motor_id: motors['PM150-0003'], kind: 'manual', reason: 'Noise at run-up; listen again', placed_by: 'Quinn Author', placed_at: at(200), released_by: 'Quinn Author', released_at: at(260), release_reason: controlCharacterReason },
    { lot_id: lots['LOT-B'], kind: 'manual', reason: 'Stator lot ST-77 under supplier review', placed_by: 'Quinn Author', placed_at: at(300) },
  ]);
  const actor = { name: 'Quinn Author', role: 'quality' };
  await db.transaction(async (trx) => {
    await recordAudit(trx, { actor, action: 'limit_set.approved', entityType: 'limit_set', entityId: pmRev2.id, after: { revision: 2 }, at: at(-5400) });
    await recordAudit(trx, { actor, action: 'station.calibration_recorded', entityType: 'station', entityId: 'EOL-1', after: { due: '2027-03-01' }, at: at(-3000) });
    await recordAudit(trx, { actor, action: 'hold.placed', entityType: 'motor', entityId: 'PM150-0003', after: { reason: 'Noise at run-up' }, reason: '=cmd|calc', at: at(200) });
    await recordAudit(trx, { actor, action: 'hold.placed', entityType: 'lot', entityId: 'LOT-B', after: { reason: 'ST-77' }, at: at(300) });
    await recordAudit(trx, { actor, action: 'hold.placed', entityType: 'motor', entityId: 'DC40-0002', after: { reason: 'other product' }, at: at(310) });
  });
  return { pm, dc, lots, motors, stations, revisions: { pmRev1, pmRev2, dcRev1 } };
}
