/**
 * Turns a `datetime` column read with raw SQL into an ISO 8601 string. TypeORM writes these columns
 * in UTC as `YYYY-MM-DD HH:MM:SS.SSS` and SQLite's `datetime('now')` default as `YYYY-MM-DD HH:MM:SS`,
 * both without a zone, so the `Z` is added here; entity reads do the same inside TypeORM.
 *
 * @param value the column value as SQLite returns it
 * @returns e.g. `2026-06-01T09:30:00.000Z`
 * @example isoFromSqlite('2026-06-01 09:30:00') // '2026-06-01T09:30:00.000Z'
 */
export function isoFromSqlite(value: string): string {
  return new Date(`${value.replace(' ', 'T')}Z`).toISOString();
}

/**
 * Writes a date the way TypeORM stores `datetime` columns (UTC, `YYYY-MM-DD HH:MM:SS.SSS`), for raw SQL that
 * compares with such columns: the text order is then the time order.
 *
 * @param date the instant
 * @returns e.g. `2026-06-01 09:30:00.000`
 * @example sqliteFromDate(new Date('2026-06-01T09:30:00Z')) // '2026-06-01 09:30:00.000'
 */
export function sqliteFromDate(date: Date): string {
  return date.toISOString().replace('T', ' ').replace('Z', '');
}
