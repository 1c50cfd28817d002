import { conditionsMatch, substrateKey, type AssayConditions } from './conditions-match';

/**
 * Groups measurements whose conditions all match one another (same substrate, temperatures within 0.5 K,
 * pH within 0.1; see {@link conditionsMatch}), so that replicates under one set of conditions can be
 * combined and measurements under different conditions are never averaged together.
 *
 * Matching is not transitive (36.8, 37.2 and 37.6 °C: each neighbour matches, the ends do not), so a group
 * is built greedily with complete linkage: measurements are visited by substrate, temperature, pH and
 * input order, and each joins the first group whose every member it matches, or starts a new one. Every
 * pair inside a group therefore matches, and the result does not depend on the input order except for
 * exact ties.
 *
 * Reference: complete-linkage clustering (Everitt, Landau, Leese & Stahl, Cluster Analysis, 5th ed.
 * (2011), §4.2), with the product's matching rule as the linkage threshold.
 *
 * @param measurements items with substrate, temperatureKelvin (K) and ph; never modified
 * @returns groups in the visiting order, each a non-empty array of the input items
 * @example
 * groupByConditions([
 *   { substrate: 'pNPA', temperatureKelvin: 310.15, ph: 6 },
 *   { substrate: 'pNPA', temperatureKelvin: 298.15, ph: 6 },
 *   { substrate: 'PNPA', temperatureKelvin: 310.35, ph: 6.05 },
 * ]).length; // 2 (25 °C alone; the two at 37 °C together)
 */
export function groupByConditions<T extends AssayConditions>(measurements: readonly T[]): T[][] {
  const order = measurements
    .map((measurement, index) => ({ measurement, index, key: substrateKey(measurement.substrate) }))
    .sort(
      (first, second) =>
        (first.key < second.key ? -1 : first.key > second.key ? 1 : 0) ||
        first.measurement.temperatureKelvin - second.measurement.temperatureKelvin ||
        first.measurement.ph - second.measurement.ph ||
        first.index - second.index,
    );
  const groups: T[][] = [];
  for (const { measurement } of order) {
    const group = groups.find((members) => members.every((member) => conditionsMatch(member, measurement)));
    if (group) group.push(measurement);
    else groups.push([measurement]);
  }
  return groups;
}
