import type { Knex } from 'knex';
import type { Statement } from './statements.js';

const markerPrefix = '\u0000value#';

/** Where the builder puts value `index`: a text compared only with the template's own bindings, never with a caller's value. */
function marker(index: number): string {
  return `${markerPrefix}${index}`;
}

/** The value a binding stands for, if it is a marker; a marker inside other text (a LIKE pattern) cannot be swapped and is refused. */
function markerIndex(binding: unknown): number | undefined {
  if (typeof binding !== 'string' || !binding.includes(markerPrefix)) return undefined;
  const index = binding.slice(markerPrefix.length);
  if (!binding.startsWith(markerPrefix) || !/^\d+$/.test(index)) {
    throw new Error('a statement template holds a value inside other text, which cannot be swapped');
  }
  return Number(index);
}

/** Values 0…count−1 as a list, for a template whose shape is the length of a list of ids. */
export function valueList(count: number, value: (index: number) => string): string[] {
  return Array.from({ length: count }, (_, i) => value(i));
}

/**
 * Statements whose text depends only on a shape (such as how many ids a list holds), built by knex
 * (MySQL dialect) once per shape and then reused with new values. Building a query costs knex
 * more CPU than MariaDB spends on a small indexed read, and these statements run for every scan
 * and every ingest batch. The builder places `value(i)` wherever the i-th value goes; knex passes
 * values through as bindings, so each later use only swaps them. A shape must fix everything the
 * text depends on: knex writes `is null` for a null value, so values must not be null.
 */
export class StatementTemplates<Shape extends string | number> {
  private readonly built = new Map<Shape, Statement[]>();

  constructor(private readonly build: (db: Knex, shape: Shape, value: (index: number) => string) => Statement[]) {}

  /** The statements of this shape with `values[i]` wherever the builder placed `value(i)`; built with `db` the first time. */
  statements(db: Knex, shape: Shape, values: readonly unknown[]): Statement[] {
    let templates = this.built.get(shape);
    if (!templates) {
      templates = this.build(db, shape, marker);
      this.built.set(shape, templates);
    }
    return templates.map((template) => ({
      sql: template.sql,
      bindings: template.bindings.map((binding) => {
        const index = markerIndex(binding);
        if (index === undefined) return binding;
        if (index >= values.length) throw new Error(`statement template needs value ${index}, given ${values.length}`);
        return values[index];
      }),
    }));
  }
}
