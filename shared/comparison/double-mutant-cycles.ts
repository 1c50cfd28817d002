import { couplingEnergy } from '../kinetics/coupling-energy';
import { deltaDeltaGActivation } from '../kinetics/delta-delta-g';
import type { FreeEnergyDifference } from '../kinetics/types';
import { GAS_CONSTANT } from '../kinetics/units';
import { combineInverseVariance, type CombinedEstimate, type ValueWithError } from './combine-inverse-variance';
import type { ComparableMeasurement } from './compare-with-parent';
import { conditionsMatch } from './conditions-match';
import { groupByConditions } from './group-by-conditions';

/** A variant as the cycle search sees it: its id, label and substitutions. */
export type CycleVariant = {
  id: number;
  label: string;
  mutations: readonly { position: number; from: string; to: string }[];
};

/** An energy with its standard error, kJ/mol. */
export type EnergyKjPerMol = { value: number; se: number };

/** The free energies of one cycle for one rate constant (kcat/Km or kcat). */
export type CycleEnergies = {
  /** ΔΔG‡ of A, B and AB against the parent, kJ/mol. */
  ddgA: EnergyKjPerMol;
  ddgB: EnergyKjPerMol;
  ddgAB: EnergyKjPerMol;
  /**
   * ΔΔG‡(A) + ΔΔG‡(B), what AB would show if the mutations were independent, kJ/mol. Its error counts
   * the parent once in each term: RT·√((se_A/k_A)² + (se_B/k_B)² + 4(se_P/k_P)²).
   */
  predictedAdditive: EnergyKjPerMol;
  /** ΔΔG_int = ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B). */
  coupling: FreeEnergyDifference;
};

type VariantRef = { id: number; label: string };

/** One double-mutant cycle under one set of matched conditions. */
export type DoubleMutantCycle = {
  combination: VariantRef;
  a: VariantRef;
  b: VariantRef;
  /** Substrate, mean temperature (K) and mean pH of the combination's measurements in this cycle. */
  substrate: string;
  temperatureKelvin: number;
  ph: number;
  measurementIds: { combination: number[]; a: number[]; b: number[]; parent: number[] };
  /** Null when one corner lacks a usable kcat/Km (or kcat) under these conditions. */
  kcatOverKm: CycleEnergies | null;
  kcat: CycleEnergies | null;
};

/** A cycle whose four corners exist as variants but were not all measured under matched conditions. */
export type UnmatchedCycle = { combination: VariantRef; a: VariantRef; b: VariantRef; reason: string };

/** Input of {@link doubleMutantCycles}. */
export type DoubleMutantCycleInput = {
  /** Every variant of the campaign that has measurements (others cannot be corners). */
  variants: readonly CycleVariant[];
  /** Measurements by variant id; rates in SI-coherent units, temperatures in K. */
  measurementsByVariant: ReadonlyMap<number, readonly ComparableMeasurement[]>;
  /** The parent variant's measurements. */
  parentMeasurements: readonly ComparableMeasurement[];
};

/**
 * Double-mutant cycles of a campaign: for every combination variant AB (two or more substitutions) and every
 * split of its substitutions into two non-empty parts A and B that were both made and measured as variants,
 * and for every condition group of AB's measurements ({@link groupByConditions}) under which the parent, A
 * and B were also measured (each matching every measurement of the group), the coupling energy
 * ΔΔG_int = ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B) ({@link couplingEnergy}) for kcat/Km and for kcat, at the group's
 * mean temperature. Replicates of each corner are combined by inverse-variance weighting. A split is reported
 * once (A holds the lowest-positioned substitution). Splits whose corners were never measured under matched
 * conditions are listed separately with the reason.
 *
 * Subsets are found through an index of which variants carry each substitution, so the search costs about
 * the number of variants sharing a substitution with AB, not 2ᵏ splits.
 *
 * Reference: Carter, Winter, Wilkinson & Fersht, Cell 38 (1984) 835 (double-mutant cycles); Horovitz,
 * Folding & Design 1 (1996) R121; Fersht, Structure and Mechanism in Protein Science (1999), ch. 15.
 *
 * @param input variants with their substitutions, their measurements and the parent's measurements
 * @throws {KineticsInputError} only for a non-finite, non-positive temperature
 * @returns matched cycles (ordered by combination label, then A's label, then temperature) and unmatched ones
 * @example
 * // kcat/Km (M⁻¹ s⁻¹) of parent 100, A 10, B 10 and AB 10 at 25 °C: ΔΔG_int = −RT ln 10.
 * const at25 = { substrate: 'S', temperatureKelvin: 298.15, ph: 7 };
 * const measured = (id: number, k: number) => [{ ...at25, id, kcatPerSecond: null, kmMolar: null, kcatOverKmPerMolarSecond: { value: k, se: 0 } }];
 * const a = { position: 1, from: 'A', to: 'G' };
 * const b = { position: 2, from: 'C', to: 'G' };
 * doubleMutantCycles({
 *   variants: [{ id: 2, label: 'A1G', mutations: [a] }, { id: 3, label: 'C2G', mutations: [b] }, { id: 4, label: 'A1G/C2G', mutations: [a, b] }],
 *   measurementsByVariant: new Map([[2, measured(12, 10)], [3, measured(13, 10)], [4, measured(14, 10)]]),
 *   parentMeasurements: measured(11, 100),
 * }).cycles[0].kcatOverKm?.coupling.kJPerMol.value; // −5.70801
 */
export function doubleMutantCycles(input: DoubleMutantCycleInput): {
  cycles: DoubleMutantCycle[];
  unmatched: UnmatchedCycle[];
} {
  const measured = input.variants.filter(
    (variant) => variant.mutations.length > 0 && (input.measurementsByVariant.get(variant.id)?.length ?? 0) > 0,
  );
  const byKey = new Map<string, CycleVariant>();
  const byToken = new Map<string, CycleVariant[]>();
  for (const variant of measured) {
    byKey.set(mutationSetKey(variant.mutations.map(token)), variant);
    for (const mutation of variant.mutations) {
      const list = byToken.get(token(mutation));
      if (list) list.push(variant);
      else byToken.set(token(mutation), [variant]);
    }
  }

  const cycles: DoubleMutantCycle[] = [];
  const unmatched: UnmatchedCycle[] = [];
  for (const combination of measured) {
    if (combination.mutations.length < 2) continue;
    const tokens = combination.mutations.map(token);
    const tokenSet = new Set(tokens);
    const lowest = [...combination.mutations].sort((first, second) => first.position - second.position)[0];
    // A holds AB's lowest-positioned substitution, so each unordered split {A, B} is visited once.
    for (const a of byToken.get(token(lowest)) ?? []) {
      if (a.mutations.length >= combination.mutations.length) continue;
      if (!a.mutations.every((mutation) => tokenSet.has(token(mutation)))) continue;
      const aTokens = new Set(a.mutations.map(token));
      const b = byKey.get(mutationSetKey(tokens.filter((candidate) => !aTokens.has(candidate))));
      if (!b) continue;
      const found = cyclesOfSplit(combination, a, b, input);
      if (found.length === 0) {
        unmatched.push({
          combination: reference(combination),
          a: reference(a),
          b: reference(b),
          reason: `the parent, ${a.label} and ${b.label} were not all measured under conditions matching a measurement of ${combination.label} (same substrate, within 0.5 °C and 0.1 pH)`,
        });
      }
      cycles.push(...found);
    }
  }
  cycles.sort(
    (first, second) =>
      compareText(first.combination.label, second.combination.label) ||
      compareText(first.a.label, second.a.label) ||
      first.temperatureKelvin - second.temperatureKelvin,
  );
  unmatched.sort(
    (first, second) =>
      compareText(first.combination.label, second.combination.label) || compareText(first.a.label, second.a.label),
  );
  return { cycles, unmatched };
}

function cyclesOfSplit(
  combination: CycleVariant,
  a: CycleVariant,
  b: CycleVariant,
  input: DoubleMutantCycleInput,
): DoubleMutantCycle[] {
  const found: DoubleMutantCycle[] = [];
  for (const group of groupByConditions(input.measurementsByVariant.get(combination.id) ?? [])) {
    const matching = (candidates: readonly ComparableMeasurement[]) =>
      candidates.filter((candidate) => group.every((member) => conditionsMatch(member, candidate)));
    const parent = matching(input.parentMeasurements);
    const aMeasurements = matching(input.measurementsByVariant.get(a.id) ?? []);
    const bMeasurements = matching(input.measurementsByVariant.get(b.id) ?? []);
    if (parent.length === 0 || aMeasurements.length === 0 || bMeasurements.length === 0) continue;

    let temperatureSum = 0;
    let phSum = 0;
    for (const member of group) {
      temperatureSum += member.temperatureKelvin;
      phSum += member.ph;
    }
    const temperatureKelvin = temperatureSum / group.length;
    const corners = { parent, a: aMeasurements, b: bMeasurements, ab: group };
    const kcatOverKm = energies(corners, 'kcatOverKmPerMolarSecond', temperatureKelvin);
    const kcat = energies(corners, 'kcatPerSecond', temperatureKelvin);
    if (kcatOverKm === null && kcat === null) continue;
    found.push({
      combination: reference(combination),
      a: reference(a),
      b: reference(b),
      substrate: group[0].substrate,
      temperatureKelvin,
      ph: phSum / group.length,
      measurementIds: {
        combination: group.map((measurement) => measurement.id),
        a: aMeasurements.map((measurement) => measurement.id),
        b: bMeasurements.map((measurement) => measurement.id),
        parent: parent.map((measurement) => measurement.id),
      },
      kcatOverKm,
      kcat,
    });
  }
  return found;
}

function energies(
  corners: Record<'parent' | 'a' | 'b' | 'ab', readonly ComparableMeasurement[]>,
  name: 'kcatOverKmPerMolarSecond' | 'kcatPerSecond',
  temperatureKelvin: number,
): CycleEnergies | null {
  const parent = combined(corners.parent, name);
  const a = combined(corners.a, name);
  const b = combined(corners.b, name);
  const ab = combined(corners.ab, name);
  if (parent === null || a === null || b === null || ab === null) return null;
  const ddgA = deltaDeltaGActivation(a, parent, temperatureKelvin).kJPerMol;
  const ddgB = deltaDeltaGActivation(b, parent, temperatureKelvin).kJPerMol;
  const rtKiloJoulesPerMol = (GAS_CONSTANT * temperatureKelvin) / 1000;
  const parentRelativeSe = parent.se / parent.value;
  return {
    ddgA,
    ddgB,
    ddgAB: deltaDeltaGActivation(ab, parent, temperatureKelvin).kJPerMol,
    predictedAdditive: {
      value: ddgA.value + ddgB.value,
      se: rtKiloJoulesPerMol * Math.hypot(a.se / a.value, b.se / b.value, 2 * parentRelativeSe),
    },
    coupling: couplingEnergy({ parent, a, b, ab }, temperatureKelvin),
  };
}

/** Inverse-variance combination of the usable values (positive, finite standard error), or null. */
function combined(
  measurements: readonly ComparableMeasurement[],
  name: 'kcatOverKmPerMolarSecond' | 'kcatPerSecond',
): CombinedEstimate | null {
  const usable: ValueWithError[] = [];
  for (const measurement of measurements) {
    const rate = measurement[name];
    if (rate && Number.isFinite(rate.value) && rate.value > 0 && Number.isFinite(rate.se) && rate.se >= 0) {
      usable.push(rate);
    }
  }
  return usable.length > 0 ? combineInverseVariance(usable) : null;
}

function token(mutation: { position: number; to: string }): string {
  return `${mutation.position}${mutation.to.toUpperCase()}`;
}

function mutationSetKey(tokens: readonly string[]): string {
  return [...tokens].sort().join('/');
}

function reference(variant: CycleVariant): VariantRef {
  return { id: variant.id, label: variant.label };
}

function compareText(first: string, second: string): number {
  return first < second ? -1 : first > second ? 1 : 0;
}
