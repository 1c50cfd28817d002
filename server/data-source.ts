import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { entities } from './entities';
import { migrations } from './migrations';

export interface DataSourceOptions {
  /** Path of the SQLite file, or `:memory:` for tests. */
  database: string;
  logging?: boolean;
}

/**
 * The application's data source: SQLite through better-sqlite3, WAL mode for file databases, foreign
 * keys enforced, and the schema owned by migrations only (`synchronize` is off).
 */
export function createDataSource({ database, logging = false }: DataSourceOptions): DataSource {
  const inMemory = database === ':memory:';
  return new DataSource({
    type: 'better-sqlite3',
    database,
    entities,
    migrations,
    synchronize: false,
    migrationsRun: false,
    logging,
    enableWAL: !inMemory,
    timeout: 10_000,
    prepareDatabase: (db: { pragma: (statement: string) => unknown }) => {
      db.pragma('foreign_keys = ON');
      db.pragma('synchronous = NORMAL');
    },
  });
}

/** Opens the data source and brings its schema up to date. */
export async function openDatabase(options: DataSourceOptions): Promise<DataSource> {
  const dataSource = createDataSource(options);
  await dataSource.initialize();
  await dataSource.runMigrations({ transaction: 'each' });
  return dataSource;
}
