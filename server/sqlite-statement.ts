import type { Database, Statement } from 'better-sqlite3';
import type { DataSource } from 'typeorm';

/**
 * A prepared statement on the data source's own better-sqlite3 connection, prepared on first use and kept.
 * For the reads every signed-in request makes (its session, its user): TypeORM's query path (query
 * runner, logging, result wrapping) costs several times the lookup itself. It runs on the same connection
 * as TypeORM, so it sees exactly what `dataSource.query` would.
 *
 * @param sql one SQL statement with `?` parameters
 * @returns a function that runs it on a data source and returns the first row, if any
 */
export function preparedRead<Row>(sql: string): (dataSource: DataSource, ...parameters: unknown[]) => Row | undefined {
  // By connection, not data source: a data source closed and opened again has a new connection.
  const statements = new WeakMap<Database, Statement>();
  return (dataSource, ...parameters) => {
    const connection = (dataSource.driver as unknown as { databaseConnection: Database }).databaseConnection;
    let statement = statements.get(connection);
    if (!statement) statements.set(connection, (statement = connection.prepare(sql)));
    return statement.get(...parameters) as Row | undefined;
  };
}
