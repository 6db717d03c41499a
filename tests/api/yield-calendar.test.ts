import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/index.js';
import { ingestTestRun } from '../../server/services/runs/ingest-test-run.js';
import { addDays } from '../../server/services/yield/plant-time.js';
import { startApiServer } from '../support/api-server.js';
import { createPlant, runDocument } from '../factories.js';
import { auditOf, parsed, signedIn, type Agent } from './setup-fixtures.js';

const calendarPath = '/api/v1/yield/shift-calendar';
const threeShifts = [
  { code: 'early', name: 'Early', startsAt: '06:00' },
  { code: 'late', name: 'Late', startsAt: '14:00' },
  { code: 'night', name: 'Night', startsAt: '22:00' },
];

describe('Plant shift calendar and time zone of the yield board', () => {
  let server: RunningServer;
  let admin: Agent;
  let manager: Agent;
  beforeAll(async () => {
    server = await startApiServer();
    admin = await signedIn(server.url, 'admin');
    manager = await signedIn(server.url, 'manager');
  });
  afterAll(async () => { await server.stop(); });

  it('when nothing is set up, then the calendar is three shifts from 06:00 in UTC with a 95 % target', async () => {
    const response = await manager.get(calendarPath).expect(200);
    expect(response.body).toEqual({
      timeZone: 'UTC', firstPassTarget: 0.95,
      shifts: [
        { code: 'early', name: 'Early (06–14)', startsAt: '06:00' },
        { code: 'late', name: 'Late (14–22)', startsAt: '14:00' },
        { code: 'night', name: 'Night (22–06)', startsAt: '22:00' },
      ],
    });
  });

  it('when admin moves the plant to Tokyo time, then it is audited and stored motors fall into Tokyo days and shifts', async () => {
    const plant = await createPlant(server.db);
    const day = new Date(Date.now() - 4 * 86_400_000).toISOString().slice(0, 10);
    // 08:00Z = 17:00 in Tokyo (late shift); 15:00Z = 00:00 next day (night shift of the day);
    // 22:00Z = 07:00 next day (early shift of the next production day).
    for (const time of ['08:00', '15:00', '22:00']) {
      const startedAt = `${day}T${time}:00.000Z`;
      await ingestTestRun(server.db, runDocument(plant, { startedAt, finishedAt: `${day}T${time}:30.000Z` }));
    }
    const utcShifts = await manager.get(`/api/v1/yield?from=${day}&to=${addDays(day, 1)}&groupBy=shift`).expect(200);
    expect(utcShifts.body.groups.map((g: { key: string }) => g.key)).toEqual([`${day}/early`, `${day}/late`, `${day}/night`]);

    const changed = await admin.put(calendarPath, { timeZone: 'Asia/Tokyo', firstPassTarget: 0.9, shifts: threeShifts, reason: 'plant runs on local time' });
    expect(changed.status).toBe(200);
    expect(changed.body).toMatchObject({ timeZone: 'Asia/Tokyo', firstPassTarget: 0.9 });
    const audit = await auditOf(server.db, 'shift_calendar', 'plant');
    expect(audit.map((e) => [e.action, e.reason])).toEqual([['shift_calendar.changed', 'plant runs on local time']]);
    expect(parsed(audit[0].before_json)).toMatchObject({ timeZone: 'UTC', firstPassTarget: 0.95 });
    expect(parsed(audit[0].after_json)).toMatchObject({ timeZone: 'Asia/Tokyo', firstPassTarget: 0.9 });

    const shifts = await manager.get(`/api/v1/yield?from=${day}&to=${addDays(day, 1)}&groupBy=shift`).expect(200);
    expect(shifts.body.groups.map((g: { key: string; tested: number }) => [g.key, g.tested]))
      .toEqual([[`${day}/late`, 1], [`${day}/night`, 1], [`${addDays(day, 1)}/early`, 1]]);
    const days = await manager.get(`/api/v1/yield?from=${day}&to=${addDays(day, 1)}&groupBy=day`).expect(200);
    expect(days.body.groups.map((g: { key: string; tested: number }) => [g.key, g.tested])).toEqual([[day, 2], [addDays(day, 1), 1]]);
  });

  it('when the calendar is malformed, then 422 names each field and nothing changes', async () => {
    const before = (await admin.get(calendarPath).expect(200)).body;
    const cases: Array<[object, string]> = [
      [{ timeZone: 'Mars/Olympus_Mons' }, 'timeZone'],
      [{ shifts: [{ code: 'early', name: 'Early', startsAt: '24:00' }] }, 'shifts[0].startsAt'],
      [{ shifts: [threeShifts[0], { ...threeShifts[1], code: 'early' }] }, 'shifts[1].code'],
      [{ firstPassTarget: 1.2 }, 'firstPassTarget'],
    ];
    for (const [change, field] of cases) {
      const response = await admin.put(calendarPath, { timeZone: 'UTC', firstPassTarget: 0.95, shifts: threeShifts, reason: 'try', ...change });
      expect(response.status, field).toBe(422);
      expect(response.body.error.fields.map((f: { field: string }) => f.field), field).toContain(field);
    }
    expect((await admin.get(calendarPath).expect(200)).body).toEqual(before);
  });

  it('when a manager or quality engineer changes the calendar, then 403: shifts belong to whoever runs the stations', async () => {
    const body = { timeZone: 'UTC', firstPassTarget: 0.95, shifts: threeShifts, reason: 'not mine to change' };
    expect((await manager.put(calendarPath, body)).status).toBe(403);
    const quality = await signedIn(server.url, 'quality');
    expect((await quality.put(calendarPath, body)).status).toBe(403);
  });
});
