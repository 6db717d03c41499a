/**
 * A JSON column's value. MariaDB's JSON is LONGTEXT; mysql2 hands it back parsed or as text
 * depending on how the server reports the column's type, so both are accepted.
 */
export function jsonColumn<T = unknown>(value: unknown): T {
  return (typeof value === 'string' ? JSON.parse(value) : value ?? null) as T;
}
