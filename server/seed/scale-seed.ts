/**
 * A deterministic synthetic registry at the size a deep mutational scan reaches: 100,000 variants on a
 * 500-residue parent across four campaigns, and 1,000,000 rate points in 100,000 ten-point assays spread
 * round-robin over the characterized variants and the parents, each assay with an approved measurement.
 * Rows are written with prepared statements in one transaction, because going through the ORM row by
 * row would take minutes.
 */
import type { DataSource } from 'typeorm';
import { formatMutationHgvs, formatMutationLabel, mutationKey, type Mutation } from '@shared/mutations/format-mutations';
import { standardAminoAcids } from '@shared/sequence/amino-acids';
import { recomputeVariantSummaries } from '../modules/comparisons/variant-summary';
import { hashPassword } from '../modules/users/password';
import { demoPassword } from './demo-accounts';
import { seededRandom } from './seeded-random';

export const scaleTargets = { variants: 100_000, ratePoints: 1_000_000, campaigns: 4, sequenceLength: 500 };
const ratePointsPerAssay = 10;
const assayCount = scaleTargets.ratePoints / ratePointsPerAssay;
const substrateMolar = [0.05, 0.1, 0.2, 0.4, 0.8, 1.6, 3.2, 6.4, 12.8, 25.6].map((mM) => mM * 1e-3);

interface SqliteStatement {
  run: (...parameters: unknown[]) => { lastInsertRowid: number | bigint };
}
interface SqliteDatabase {
  prepare: (sql: string) => SqliteStatement;
  transaction: <T>(work: () => T) => () => T;
}

/** Writes the synthetic registry into an empty, migrated database and returns the row counts. */
export async function seedScaleRegistry(dataSource: DataSource): Promise<{ variants: number; mutations: number; assays: number; ratePoints: number; measurements: number }> {
  const random = seededRandom(500_000);
  const letters = standardAminoAcids.map((acid) => acid.oneLetter);
  const sequence = Array.from({ length: scaleTargets.sequenceLength }, (_, index) => (index === 0 ? 'M' : random.pick(letters))).join('');
  const passwordHash = await hashPassword(demoPassword);

  const driver = dataSource.driver as unknown as { databaseConnection: SqliteDatabase };
  const db = driver.databaseConnection;
  const now = new Date().toISOString().replace('T', ' ').slice(0, 19);

  const counts = { variants: 0, mutations: 0, assays: 0, ratePoints: 0, measurements: 0 };
  const insertUser = db.prepare(`INSERT INTO users (email, name, password_hash, role, active, version) VALUES (?, ?, ?, ?, 1, 1)`);
  const insertEnzyme = db.prepare(`INSERT INTO enzymes (name, ec_number, organism, sequence, cofactors, version) VALUES (?, '3.5.1.4', 'synthetic construct', ?, '[]', 1)`);
  const insertSite = db.prepare(`INSERT INTO catalytic_sites (enzyme_id, position, residue, role) VALUES (?, ?, ?, ?)`);
  const insertCampaign = db.prepare(
    `INSERT INTO campaigns (name, objective, enzyme_id, target_substrate, target_ph, target_temperature_k, lead_id, status, version) VALUES (?, 'Synthetic scale test', ?, 'substrate S', 7.0, 310.15, ?, 'active', 1)`,
  );
  const insertVariant = db.prepare(
    `INSERT INTO variants (campaign_id, enzyme_id, label, hgvs, mutation_key, mutation_count, first_position, status, summary_measurement_count, summary_flags, version, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, 0, '', 1, ?, ?)`,
  );
  const insertMutation = db.prepare(`INSERT INTO mutations (variant_id, position, from_residue, to_residue) VALUES (?, ?, ?, ?)`);
  const insertAssay = db.prepare(
    `INSERT INTO assays (variant_id, substrate, temperature_k, ph, buffer_name, buffer_molar, enzyme_molar, enzyme_unit, method, assay_date, s_unit, v_unit, replicate_count, version, created_at, updated_at)
     VALUES (?, 'substrate S', 310.15, 7.0, 'HEPES', 0.05, 1e-8, 'nM', 'continuous', '2026-06-01', 'mM', 'µM/min', 1, 1, ?, ?)`,
  );
  const insertPoint = db.prepare(`INSERT INTO rate_points (assay_id, substrate_molar, rate_molar_per_second, replicate, excluded) VALUES (?, ?, ?, 1, 0)`);
  const insertMeasurement = db.prepare(
    `INSERT INTO measurements (assay_id, variant_id, source, model, vmax, kcat, kcat_se, km, km_se, kcat_over_km, kcat_over_km_se, ci95, degrees_of_freedom, point_count, substrate_min_molar, substrate_max_molar, fitting_method, warnings, flags, completeness_score, completeness_missing, review_state, version, created_at, updated_at)
     VALUES (?, ?, 'entered', 'michaelis-menten', ?, ?, ?, ?, ?, ?, ?, '{}', 8, 10, ?, ?, 'synthetic', '[]', '[]', 0.8, '[]', 'approved', 1, ?, ?)`,
  );

  db.transaction(() => {
    const roles = ['admin', 'lead', 'kineticist', 'biologist', 'viewer'];
    for (const role of roles) insertUser.run(`${role}@kcatalog.example`, `Scale ${role}`, passwordHash, role);
    const enzymeId = Number(insertEnzyme.run('Synthetic scale parent', sequence).lastInsertRowid);
    const siteRoles = ['nucleophile', 'general base', 'acid/base', 'oxyanion hole', 'metal ligand', 'substrate binding', 'electrostatic'];
    siteRoles.forEach((role, index) => {
      const position = 40 + index * 61;
      insertSite.run(enzymeId, position, sequence[position - 1], role);
    });

    const variantsPerCampaign = scaleTargets.variants / scaleTargets.campaigns;
    // Variants that get assays, with their kinetic factors so replicate assays agree with each other.
    const measured: { variantId: number; kcatFactor: number; kmFactor: number }[] = [];
    for (let campaignIndex = 0; campaignIndex < scaleTargets.campaigns; campaignIndex += 1) {
      const campaignId = Number(insertCampaign.run(`Scale campaign ${campaignIndex + 1}`, enzymeId, 2).lastInsertRowid);
      const seen = new Set<string>();
      const parentId = Number(insertVariant.run(campaignId, enzymeId, 'parent', 'p.=', 'parent', 0, null, 'characterized', now, now).lastInsertRowid);
      counts.variants += 1;
      measured.push({ variantId: parentId, kcatFactor: 1, kmFactor: 1 });
      while (seen.size < variantsPerCampaign - 1) {
        const mutationCount = seen.size < 9_000 ? 1 : random.uniform() < 0.8 ? 2 : 3;
        const mutations = randomMutations(mutationCount);
        const key = mutationKey(mutations);
        if (seen.has(key)) continue;
        seen.add(key);
        const status = random.pick(['designed', 'cloned', 'expressed', 'purified', 'characterized', 'characterized', 'characterized']);
        const variantId = Number(
          insertVariant.run(campaignId, enzymeId, formatMutationLabel(mutations), formatMutationHgvs(mutations), key, mutations.length, mutations[0].position, status, now, now).lastInsertRowid,
        );
        counts.variants += 1;
        for (const mutation of mutations) {
          insertMutation.run(variantId, mutation.position, mutation.from, mutation.to);
          counts.mutations += 1;
        }
        if (status === 'characterized') {
          measured.push({ variantId, kcatFactor: Math.exp(random.normal() * 1.2 - 0.3), kmFactor: Math.exp(random.normal() * 0.6) });
        }
      }
    }
    for (let assayIndex = 0; assayIndex < assayCount; assayIndex += 1) {
      const { variantId, kcatFactor, kmFactor } = measured[assayIndex % measured.length];
      addAssay(variantId, kcatFactor, kmFactor);
    }
  })();

  function randomMutations(count: number): Mutation[] {
    const positions = new Set<number>();
    while (positions.size < count) positions.add(2 + Math.floor(random.uniform() * (scaleTargets.sequenceLength - 1)));
    return [...positions]
      .sort((a, b) => a - b)
      .map((position) => {
        const from = sequence[position - 1];
        let to = from;
        while (to === from) to = random.pick(letters);
        return { position, from, to };
      });
  }

  function addAssay(variantId: number, kcatFactor: number, kmFactor: number): void {
    const assayId = Number(insertAssay.run(variantId, now, now).lastInsertRowid);
    counts.assays += 1;
    const kcatPerSecond = 10 * kcatFactor;
    const kmMolar = 1e-3 * kmFactor;
    const enzymeMolar = 1e-8;
    for (const s of substrateMolar) {
      const v = (kcatPerSecond * enzymeMolar * s) / (kmMolar + s);
      insertPoint.run(assayId, s, v * (1 + 0.04 * random.normal()));
      counts.ratePoints += 1;
    }
    const kcatOverKm = kcatPerSecond / kmMolar;
    insertMeasurement.run(
      assayId, variantId, kcatPerSecond * enzymeMolar, kcatPerSecond, kcatPerSecond * 0.05, kmMolar, kmMolar * 0.08, kcatOverKm, kcatOverKm * 0.09,
      substrateMolar[0], substrateMolar[substrateMolar.length - 1], now, now,
    );
    counts.measurements += 1;
  }

  // Summaries through the same code the API uses, so the registry sorts on real comparisons.
  const campaigns = (await dataSource.query('SELECT id FROM campaigns')) as { id: number }[];
  for (const { id } of campaigns) await dataSource.transaction((manager) => recomputeVariantSummaries(manager, id));

  return counts;
}
