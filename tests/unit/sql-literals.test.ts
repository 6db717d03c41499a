import { describe, expect, it } from 'vitest';
import mysql from 'mysql2';
import { numberLiteral, wordLiteral } from '../../server/db/sql-literals.js';

// The measurements of an ingest batch are written as SQL text instead of bound values; the text
// must be what the driver's own escaping (mysql2's escape, the reference) writes for the same value.
describe('SQL literals', () => {
  it('when a number is written, then the text equals the driver escaping of it', () => {
    const values = [0, -0, 1, -1, 1.5, 0.1 + 0.2, 1e-7, -2.5e-12, 1e21, 123456789012345680000, Number.MAX_VALUE, -Number.MAX_VALUE, Number.MIN_VALUE, 49.987, 2 ** 53 + 2];
    for (const value of values) expect(numberLiteral(value)).toBe(mysql.escape(value));
    expect(numberLiteral(null)).toBe(mysql.escape(null));
  });

  it('when a number is not finite, then it is refused rather than written', () => {
    for (const value of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) expect(() => numberLiteral(value)).toThrow(/not a finite number/);
    expect(() => numberLiteral('1; DROP TABLE x' as unknown as number)).toThrow(/not a finite number/);
  });

  it('when a word is one of the allowed, then it is quoted as the driver quotes it; any other is refused', () => {
    expect(wordLiteral('pass', ['pass', 'fail'])).toBe(mysql.escape('pass'));
    expect(wordLiteral('fail', ['pass', 'fail'])).toBe(mysql.escape('fail'));
    expect(() => wordLiteral("pass'", ['pass', 'fail'] as string[])).toThrow(/not one of pass, fail/);
    // Even a listed word is refused when it is not plain lower-case letters.
    expect(() => wordLiteral("it's", ["it's"])).toThrow(/not one of it's/);
  });
});
