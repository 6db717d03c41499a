import { describe, expect, it } from 'vitest';
import knexFactory from 'knex';
import { StatementTemplates } from '../../server/db/statement-templates.js';

// A knex that only builds SQL (MySQL dialect); nothing connects.
const db = knexFactory({ client: 'mysql2' });

const byIdsAndSerial = (serial: string, ids: ReadonlyArray<number | string>) => db('motors')
  .whereIn('lot_id', ids).andWhere({ serial }).orderBy('id').limit(500).select('id').toSQL();

describe('StatementTemplates', () => {
  it('when a shape is used again, then knex built it once and each use carries its own values, as knex would have built them', () => {
    let builds = 0;
    const templates = new StatementTemplates<number>((knex, count, value) => {
      builds += 1;
      return [byIdsAndSerial(value(0), Array.from({ length: count }, (_, i) => value(i + 1)))];
    });
    const first = templates.statements(db, 2, ['BX-1', 11, 12])[0];
    const second = templates.statements(db, 2, ['BX-2', 21, 22])[0];
    const third = templates.statements(db, 3, ['BX-3', 31, 32, 33])[0];
    expect(builds).toBe(2);
    for (const [statement, serial, ids] of [[first, 'BX-1', [11, 12]], [second, 'BX-2', [21, 22]], [third, 'BX-3', [31, 32, 33]]] as const) {
      const direct = byIdsAndSerial(serial, ids);
      expect(statement.sql).toBe(direct.sql);
      expect(statement.bindings).toEqual(direct.bindings);
    }
    expect(second.bindings).toEqual([21, 22, 'BX-2', 500]);
  });

  it('when a value sits inside other text (a LIKE pattern), then the template refuses it rather than send the marker', () => {
    const templates = new StatementTemplates<'prefix'>((knex, _shape, value) => [db('motors').where('serial', 'like', `${value(0)}%`).select('id').toSQL()]);
    expect(() => templates.statements(db, 'prefix', ['BX0'])).toThrow(/inside other text/);
  });

  it('when fewer values are given than the template places, then it refuses rather than send a marker', () => {
    const templates = new StatementTemplates<'one'>((knex, _shape, value) => [byIdsAndSerial(value(0), [value(1)])]);
    expect(() => templates.statements(db, 'one', ['BX-1'])).toThrow(/needs value 1/);
  });
});
