import { describe, expect, it } from 'vitest';
import { openDatabase } from '@server/data-source';

describe('migrations', () => {
  it('build the whole schema on an empty database, leaving nothing for the entities to change', async () => {
    const dataSource = await openDatabase({ database: ':memory:' });
    try {
      const tables = (await dataSource.query(`SELECT name FROM sqlite_master WHERE type = 'table'`)) as { name: string }[];
      expect(tables.map((table) => table.name)).toEqual(expect.arrayContaining(['users', 'sessions', 'migrations']));
      const pending = await dataSource.driver.createSchemaBuilder().log();
      expect(pending.upQueries).toEqual([]);
      const [{ foreign_keys: foreignKeys }] = (await dataSource.query('PRAGMA foreign_keys')) as { foreign_keys: number }[];
      expect(foreignKeys).toBe(1);
    } finally {
      await dataSource.destroy();
    }
  });

  it('run again as a no-op on a migrated database', async () => {
    const dataSource = await openDatabase({ database: ':memory:' });
    try {
      const executed = await dataSource.runMigrations();
      expect(executed).toEqual([]);
    } finally {
      await dataSource.destroy();
    }
  });
});
