/**
 * `npm run seed:scale`: builds the synthetic 100,000-variant / 1,000,000-rate-point registry in its own
 * data folder (KCATALOG_SCALE_DATA_DIR, default ./data-scale), replacing any earlier one.
 */
import { mkdirSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { openDatabase } from '../data-source';
import { scaleTargets, seedScaleRegistry } from '../seed/scale-seed';

const dataDir = resolve(process.env.KCATALOG_SCALE_DATA_DIR ?? './data-scale');
rmSync(dataDir, { recursive: true, force: true });
mkdirSync(dataDir, { recursive: true });

const startedAt = performance.now();
const dataSource = await openDatabase({ database: join(dataDir, 'kcatalog.sqlite') });
const counts = await seedScaleRegistry(dataSource);
const seededAt = performance.now();
await dataSource.query('ANALYZE');
await dataSource.destroy();

console.log(`Scale registry in ${dataDir} (targets: ${scaleTargets.variants} variants, ${scaleTargets.ratePoints} rate points)`);
console.log(`  ${counts.variants} variants, ${counts.mutations} mutations, ${counts.assays} assays, ${counts.ratePoints} rate points, ${counts.measurements} measurements`);
console.log(`  written in ${((seededAt - startedAt) / 1000).toFixed(1)} s`);
