import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startApiServer } from '../support/api-server.js';
import { truncateAll } from '../support/migrate.js';
import { signIn } from '../support/sign-in.js';
import type { RunningServer } from '../../server/index.js';
import { motorListSchema } from '../../server/openapi/response-schemas.js';
import type { MotorListFilter } from '../../server/services/motors/list-motors.js';
import { leadingFilter, listIndexes, motorPageQuery } from '../../server/services/motors/motor-list-query.js';
import { resolveFilterCodes } from '../../server/services/motors/motor-filter-ids.js';
import { impliedSortBounds } from '../../server/services/motors/motor-list-bounds.js';
import { createLot, createPlant, createStation, type LotFixture, type PlantFixture, type StationFixture } from '../factories.js';

type Motor = { id: number; serial: string; lot: string; station: string | null; status: string; testedAt: Date | null };

// Motors written straight into the table so that many share one last_tested_at: the keyset
// cursor must break those ties by id, and hold its place across the untested block (NULL times).
describe('motors list: keyset paging with ties, on every index it reads', () => {
  let server: RunningServer;
  let plant: PlantFixture;
  let otherLot: LotFixture;
  let otherStation: StationFixture;
  let cookie: string;
  let motors: Motor[];

  beforeAll(async () => { server = await startApiServer(); });
  afterAll(async () => { await server.stop(); });
  beforeEach(async () => {
    await truncateAll(server.db);
    cookie = (await signIn(server.url, 'operator')).cookie;
    plant = await createPlant(server.db);
    otherLot = await createLot(server.db, plant.product);
    otherStation = await createStation(server.db, { clientId: null });
    const tie = new Date('2026-11-20T08:00:00.000Z');
    const later = new Date('2026-11-21T08:00:00.000Z');
    motors = [];
    // 24 motors: three share `tie`, three share `later`, four untested; serials out of id order.
    for (let i = 0; i < 24; i++) {
      const serial = `FT${String((i * 7) % 24).padStart(4, '0')}${String(i).padStart(2, '0')}`;
      const testedAt = i % 6 === 5 ? null : i % 4 === 0 ? tie : i % 4 === 1 ? later : new Date(tie.getTime() + (i - 12) * 3_600_000);
      const lot = i % 3 === 0 ? otherLot : plant.lot;
      const station = testedAt === null ? null : i % 2 === 0 ? plant.station : otherStation;
      const status = testedAt === null ? 'not tested' : i % 5 === 0 ? 'failed' : 'passed';
      const [id] = await server.db('motors').insert({
        serial, product_id: plant.product.id, lot_id: lot.id, status, attempts: testedAt ? 1 : 0,
        last_station_id: station?.id ?? null, last_tested_at: testedAt, created_at: new Date(),
      });
      motors.push({ id: Number(id), serial, lot: lot.code, station: station?.code ?? null, status, testedAt });
    }
  });

  /** Every page of a listing, two at a time, following nextCursor to the end. */
  async function walk(query: string): Promise<string[]> {
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const response = await request(server.url).get(`/api/v1/motors?limit=2&${query}${cursor ? `&cursor=${cursor}` : ''}`).set('cookie', cookie).expect(200);
      const page = motorListSchema.parse(response.body);
      seen.push(...page.items.map((m) => m.serial));
      cursor = page.nextCursor;
    } while (cursor);
    return seen;
  }

  /** The expected order: MariaDB puts NULL first ascending and last descending; ties go by id. */
  function byTime(selected: Motor[], order: 'asc' | 'desc'): string[] {
    const key = (m: Motor) => (m.testedAt === null ? -Infinity : m.testedAt.getTime());
    const sorted = [...selected].sort((a, b) => key(a) - key(b) || a.id - b.id);
    return (order === 'asc' ? sorted : sorted.reverse()).map((m) => m.serial);
  }

  const filters: Array<[string, (m: Motor) => boolean]> = [
    ['', () => true],
    ['lot=LOT', (m) => m.lot === 'LOT'],
    ['station=STATION', (m) => m.station === 'STATION'],
    ['status=passed', (m) => m.status === 'passed'],
    ['status=failed&product=PRODUCT', (m) => m.status === 'failed'],
    ['product=PRODUCT', () => true],
  ];

  for (const [template, keep] of filters) {
    for (const order of ['asc', 'desc'] as const) {
      it(`when motors sharing a test time are paged by lastTestedAt ${order}${template ? ` with ${template}` : ''}, then each comes exactly once in order`, async () => {
        const query = template.replace('LOT', otherLot.code).replace('STATION', otherStation.code).replace('PRODUCT', plant.product.code);
        const fill = (m: Motor) => keep({ ...m, lot: m.lot === otherLot.code ? 'LOT' : m.lot, station: m.station === otherStation.code ? 'STATION' : m.station });
        const expected = byTime(motors.filter(fill), order);
        expect(expected.length).toBeGreaterThan(2);
        expect(await walk(`sort=lastTestedAt&order=${order}${query ? `&${query}` : ''}`)).toEqual(expected);
      });
    }
  }

  it('when a serial prefix is paged newest first, then its tested and untested motors come once each, in time order', async () => {
    const matching = motors.filter((m) => m.serial.startsWith('FT001'));
    expect(matching.some((m) => m.testedAt === null)).toBe(true);
    for (const order of ['asc', 'desc'] as const) {
      expect(await walk(`sort=lastTestedAt&order=${order}&serialPrefix=FT001`)).toEqual(byTime(matching, order));
    }
    expect(await walk('sort=lastTestedAt&order=desc&serialPrefix=FT9')).toEqual([]);
  });

  it('when a tested window is paged by serial, then exactly its motors come, in serial order', async () => {
    const from = new Date('2026-11-20T06:00:00.000Z');
    const to = new Date('2026-11-21T08:00:00.000Z'); // exclusive: the motors tested at 08:00 that day stay out
    const inside = motors.filter((m) => m.testedAt !== null && m.testedAt >= from && m.testedAt < to).map((m) => m.serial).sort();
    expect(inside.length).toBeGreaterThan(2);
    const window = `from=${from.toISOString()}&to=${to.toISOString()}`;
    expect(await walk(`sort=serial&order=asc&${window}`)).toEqual(inside);
    expect(await walk(`sort=serial&order=desc&${window}&station=${otherStation.code}`))
      .toEqual(motors.filter((m) => inside.includes(m.serial) && m.station === otherStation.code).map((m) => m.serial).sort().reverse());
  });

  it('when paged by serial in either order, then every motor comes once in serial order', async () => {
    const serials = motors.map((m) => m.serial).sort();
    expect(await walk('sort=serial&order=asc')).toEqual(serials);
    expect(await walk('sort=serial&order=desc')).toEqual([...serials].reverse());
    expect(await walk(`sort=serial&order=desc&lot=${otherLot.code}`)).toEqual(motors.filter((m) => m.lot === otherLot.code).map((m) => m.serial).sort().reverse());
  });

  it('when a lot of another product is asked for with a product, then the list is empty', async () => {
    const product = await server.db('products').insert({ ...(await server.db('products').first()), id: undefined, code: 'TP-OTHER' });
    expect(product).toHaveLength(1);
    const page = await request(server.url).get(`/api/v1/motors?product=TP-OTHER&lot=${otherLot.code}`).set('cookie', cookie).expect(200);
    expect(page.body).toEqual({ items: [], nextCursor: null });
  });

  it('when any filter mix is explained, then MariaDB reads the chosen index in order and never sorts', async () => {
    const values = {
      product: plant.product.code, lot: otherLot.code, status: 'failed' as const, station: otherStation.code,
      from: new Date('2026-11-01T00:00:00Z'), to: new Date('2026-12-01T00:00:00Z'), serialPrefix: 'FT00',
    };
    const keys = Object.keys(values) as Array<keyof typeof values>;
    const cursors = {
      serial: [null, { sort: 'serial', serial: 'FT0010' }],
      lastTestedAt: [null, { sort: 'lastTestedAt', testedAt: '2026-11-20T08:00:00.000Z', id: 12 }, { sort: 'lastTestedAt', testedAt: null, id: 12 }],
    } as const;
    let explained = 0;
    let nothingMatches = 0;
    for (let mask = 0; mask < 1 << keys.length; mask++) {
      const chosen = Object.fromEntries(keys.filter((_, i) => mask & (1 << i)).map((k) => [k, values[k]]));
      for (const sort of ['serial', 'lastTestedAt'] as const) {
        for (const order of ['asc', 'desc'] as const) {
          for (const cursor of cursors[sort]) {
            const filter: MotorListFilter = { ...chosen, limit: 50, sort, order };
            const ids = await resolveFilterCodes(server.db, filter);
            if (!ids) throw new Error('every code of the test exists');
            const bounds = await impliedSortBounds(server.db, filter, ids);
            if (!bounds) { // no motor matches: the page query is not run
              nothingMatches++;
              continue;
            }
            const [plan] = await server.db.raw(`EXPLAIN ${motorPageQuery(server.db, filter, ids, cursor, bounds).toString()}`);
            const rows = plan as Array<{ table: string | null; key: string; Extra: string }>;
            const motorsRow = rows.find((row) => row.table === 'motors');
            const context = JSON.stringify({ chosen, sort, order, cursor });
            if (motorsRow) {
              expect(motorsRow.key, context).toBe(listIndexes[sort][leadingFilter(filter, ids)]);
              expect(motorsRow.Extra, context).not.toContain('filesort');
            } else {
              // e.g. a from-date with the cursor in the untested block: nothing can match, nothing is read.
              expect(rows[0].Extra, context).toMatch(/Impossible WHERE/);
            }
            explained++;
          }
        }
      }
    }
    expect(explained + nothingMatches).toBe(128 * 2 * (2 + 3));
    expect(explained).toBeGreaterThan(nothingMatches);
  });
});
