import { KineticsInputError } from './kinetics-input-error';
import { POORLY_DETERMINED_RELATIVE_SE } from './summarize-fit';

/** kcat/Km from here on approaches the diffusion limit of about 10⁸–10⁹ M⁻¹ s⁻¹. */
export const DIFFUSION_LIMIT_APPROACH_PER_MOLAR_SECOND = 1e8;
/** kcat/Km above this is faster than diffusion allows, so most likely a unit or concentration error. */
export const DIFFUSION_LIMIT_IMPLAUSIBLE_PER_MOLAR_SECOND = 1e10;
/** Substrate concentrations should reach down to this multiple of Km … */
export const SPAN_LOWER_KM_MULTIPLE = 0.2;
/** … and up to this multiple of Km, for both parameters to be well determined. */
export const SPAN_UPPER_KM_MULTIPLE = 5;

/** A quantity with an optional standard error in the same unit. */
export type Measured = { value: number; se?: number };

/** What is known about one measurement, in SI-coherent units (the application stores them so). */
export type PlausibilityInput = {
  kcatPerSecond?: Measured;
  kmMolar?: Measured;
  kcatOverKmPerMolarSecond?: Measured;
  /** Every substrate concentration tested, M. */
  substrateMolar?: readonly number[];
};

export type PlausibilityFlag = {
  code:
    | 'above-diffusion-limit'
    | 'near-diffusion-limit'
    | 'km-above-range'
    | 'range-does-not-span-km'
    | 'poorly-determined';
  severity: 'implausible' | 'warning';
  message: string;
};

/**
 * Plausibility flags for one kinetic measurement:
 *
 * - kcat/Km above 10¹⁰ M⁻¹ s⁻¹ is physically implausible (faster than diffusion-controlled encounter);
 *   at or above 10⁸ it approaches the diffusion limit of 10⁸–10⁹ M⁻¹ s⁻¹ (Alberty & Hammes 1958);
 * - Km above the highest substrate concentration tested means Vmax and Km are extrapolated;
 * - a substrate range that does not reach from 0.2 × Km to 5 × Km leaves Km poorly determined
 *   (the usual design advice, e.g. Cornish-Bowden 2012; a rule of thumb, not a sharp limit);
 * - a relative standard error above 50 % makes an estimate poorly determined.
 *
 * Negative or non-finite values are refused rather than flagged: they are not measurements.
 *
 * Reference: Alberty & Hammes, J. Phys. Chem. 62 (1958) 154; Bar-Even et al., Biochemistry 50 (2011)
 * 4402; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param input.kcatPerSecond kcat, s⁻¹ (> 0), optional standard error
 * @param input.kmMolar Km, M (> 0), optional standard error
 * @param input.kcatOverKmPerMolarSecond kcat/Km, M⁻¹ s⁻¹ (> 0), optional standard error
 * @param input.substrateMolar substrate concentrations tested, M (≥ 0, at least one > 0)
 * @throws {KineticsInputError} a value that is not finite and positive, a standard error that is not
 *   finite and non-negative, or substrate concentrations that are not finite and non-negative or all zero
 * @returns the flags that apply, in the order above; empty when nothing is suspicious
 * @example
 * plausibilityFlags({ kcatOverKmPerMolarSecond: { value: 3e8 } })[0].code; // 'near-diffusion-limit'
 */
export function plausibilityFlags(input: PlausibilityInput): PlausibilityFlag[] {
  const estimates: [string, Measured | undefined][] = [
    ['kcat', input.kcatPerSecond],
    ['Km', input.kmMolar],
    ['kcat/Km', input.kcatOverKmPerMolarSecond],
  ];
  for (const [label, measured] of estimates) {
    if (measured === undefined) continue;
    if (!(Number.isFinite(measured.value) && measured.value > 0)) {
      throw new KineticsInputError(`plausibilityFlags requires a finite, positive value (${label})`);
    }
    if (measured.se !== undefined && !(Number.isFinite(measured.se) && measured.se >= 0)) {
      throw new KineticsInputError(`plausibilityFlags requires a finite, non-negative standard error (${label})`);
    }
  }
  const substrate = input.substrateMolar;
  if (substrate !== undefined) {
    if (!substrate.every((s) => Number.isFinite(s) && s >= 0) || !substrate.some((s) => s > 0)) {
      throw new KineticsInputError(
        'plausibilityFlags requires finite, non-negative substrate concentrations, at least one of them positive',
      );
    }
  }

  const flags: PlausibilityFlag[] = [];
  const specificity = input.kcatOverKmPerMolarSecond?.value;
  if (specificity !== undefined && specificity > DIFFUSION_LIMIT_IMPLAUSIBLE_PER_MOLAR_SECOND) {
    flags.push({
      code: 'above-diffusion-limit',
      severity: 'implausible',
      message:
        `kcat/Km of ${scientific(specificity)} M⁻¹ s⁻¹ is above 10¹⁰ M⁻¹ s⁻¹, faster than diffusion allows; ` +
        'check the units and the enzyme concentration',
    });
  } else if (specificity !== undefined && specificity >= DIFFUSION_LIMIT_APPROACH_PER_MOLAR_SECOND) {
    flags.push({
      code: 'near-diffusion-limit',
      severity: 'warning',
      message: `kcat/Km of ${scientific(specificity)} M⁻¹ s⁻¹ approaches the diffusion limit (10⁸–10⁹ M⁻¹ s⁻¹)`,
    });
  }

  const km = input.kmMolar?.value;
  if (km !== undefined && substrate !== undefined) {
    // A loop, not Math.max(...substrate): a deep mutational scan can pass more values than a call takes arguments.
    let highest = 0;
    let lowestPositive = Number.POSITIVE_INFINITY;
    for (const s of substrate) {
      highest = Math.max(highest, s);
      if (s > 0) lowestPositive = Math.min(lowestPositive, s);
    }
    if (km > highest) {
      flags.push({
        code: 'km-above-range',
        severity: 'warning',
        message:
          `Km of ${concentrationText(km)} is above the highest substrate concentration tested ` +
          `(${concentrationText(highest)}); Km and kcat are extrapolated`,
      });
    }
    if (lowestPositive > SPAN_LOWER_KM_MULTIPLE * km || highest < SPAN_UPPER_KM_MULTIPLE * km) {
      flags.push({
        code: 'range-does-not-span-km',
        severity: 'warning',
        message:
          `the substrate range tested (${concentrationText(lowestPositive)} to ${concentrationText(highest)}) does not span ` +
          `0.2–5 × Km (${concentrationText(SPAN_LOWER_KM_MULTIPLE * km)} to ${concentrationText(SPAN_UPPER_KM_MULTIPLE * km)}), ` +
          'so Km is poorly determined',
      });
    }
  }

  for (const [label, measured] of estimates) {
    if (measured?.se === undefined) continue;
    const relativeSe = measured.se / measured.value;
    if (relativeSe > POORLY_DETERMINED_RELATIVE_SE) {
      flags.push({
        code: 'poorly-determined',
        severity: 'warning',
        message: `${label} is poorly determined: its standard error is ${Math.round(100 * relativeSe)} % of its value`,
      });
    }
  }
  return flags;
}

const superscriptDigits: Record<string, string> = { '-': '⁻', 0: '⁰', 1: '¹', 2: '²', 3: '³', 4: '⁴', 5: '⁵', 6: '⁶', 7: '⁷', 8: '⁸', 9: '⁹' };

function scientific(value: number): string {
  const [mantissa, exponent] = value.toExponential(2).split('e');
  const power = String(Number(exponent)).replace(/./g, (character) => superscriptDigits[character] ?? character);
  return `${mantissa} × 10${power}`;
}

const concentrationUnits: readonly (readonly [unit: string, molar: number])[] = [
  ['M', 1],
  ['mM', 1e-3],
  ['µM', 1e-6],
  ['nM', 1e-9],
  ['pM', 1e-12],
];

// A concentration as a bench scientist writes it (three significant figures in the largest unit that keeps the
// number at or above 1): messages are read next to the rate grid, where substrate is in mM or µM, not in M.
function concentrationText(molar: number): string {
  if (!(molar > 0)) return `${molar} M`;
  const [unit, factor] = concentrationUnits.find(([, size]) => molar >= size * 0.9995) ?? concentrationUnits[concentrationUnits.length - 1];
  return `${Number((molar / factor).toPrecision(3))} ${unit}`;
}
