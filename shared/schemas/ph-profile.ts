import { z } from 'zod';
import {
  rateUnits,
  specificityUnits,
  toMolarPerSecond,
  toPerMolarPerSecond,
  toPerSecond,
  turnoverUnits,
  type RateUnitInput,
  type SpecificityUnitInput,
  type TurnoverUnitInput,
} from './assay';
import { finiteNumber } from './finite-number';

export const phModels = ['bell', 'acid', 'base'] as const;
export type PhModelName = (typeof phModels)[number];

export const phRateKinds = ['kcat', 'kcatOverKm', 'v0'] as const;
export type PhRateKindName = (typeof phRateKinds)[number];

/** The SI unit each rate kind is stored in. */
export const phRateSiUnit = { kcat: 's⁻¹', kcatOverKm: 'M⁻¹ s⁻¹', v0: 'M s⁻¹' } as const satisfies Record<
  PhRateKindName,
  string
>;

/** Fitted parameters of each pH model (kmax and one or two pKa values). */
const phParameterCount: Record<PhModelName, number> = { bell: 3, acid: 2, base: 2 };

/** Most points one pH profile may carry. */
export const maxPhPoints = 10_000;

const unitsByKind: Record<PhRateKindName, readonly string[]> = {
  kcat: turnoverUnits,
  kcatOverKm: specificityUnits,
  v0: rateUnits,
};

/**
 * Converts a rate of the given kind to its SI unit ({@link phRateSiUnit}).
 *
 * @param value the rate in `unit`
 * @param kind which rate was measured
 * @param unit a unit of that kind (checked by {@link createPhProfileInput})
 * @throws {KineticsInputError} when `value` is not finite
 * @returns the rate in s⁻¹, M⁻¹ s⁻¹ or M s⁻¹
 * @example phRateToSi(60, 'kcat', '1/min'); // 1
 */
export function phRateToSi(value: number, kind: PhRateKindName, unit: string): number {
  if (kind === 'kcat') return toPerSecond(value, unit as TurnoverUnitInput);
  if (kind === 'kcatOverKm') return toPerMolarPerSecond(value, unit as SpecificityUnitInput);
  return toMolarPerSecond(value, unit as RateUnitInput);
}


/**
 * Body of POST /api/ph-profiles: a rate of one kind (kcat, kcat/Km or v0, in `unit`) against pH for one
 * variant, fitted with the bell-shaped two-ionization model or a single acid or base limb. Excluded points
 * are stored and left out of the fit.
 */
export const createPhProfileInput = z
  .object({
    variantId: z.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1'),
    substrate: z.string({ error: 'is required' }).trim().min(1, 'is required').max(200, 'must be at most 200 characters'),
    temperatureC: finiteNumber().min(-20, 'must be between -20 and 150 °C').max(150, 'must be between -20 and 150 °C'),
    rateKind: z.enum(phRateKinds, { error: `must be one of ${phRateKinds.join(', ')}` }),
    unit: z.string({ error: 'is required' }),
    model: z.enum(phModels, { error: `must be one of ${phModels.join(', ')}` }),
    points: z
      .array(
        z.object({
          ph: finiteNumber().min(0, 'must be between 0 and 14').max(14, 'must be between 0 and 14'),
          k: finiteNumber().nonnegative('must be at least 0'),
          excluded: z.boolean({ error: 'must be true or false' }).default(false),
        }),
        { error: 'must be a list of points' },
      )
      .min(1, 'must contain at least one point')
      .max(maxPhPoints, `must have at most ${maxPhPoints} points`),
  })
  .superRefine((profile, context) => {
    const allowed = unitsByKind[profile.rateKind];
    if (!allowed.includes(profile.unit)) {
      context.addIssue({
        code: 'custom',
        path: ['unit'],
        message: `must be a ${profile.rateKind} unit such as ${allowed.slice(0, 3).join(', ')}`,
      });
    }
    const used = profile.points.filter((point) => !point.excluded);
    const required = phParameterCount[profile.model] + 1;
    if (new Set(used.map((point) => point.ph)).size < required) {
      context.addIssue({
        code: 'custom',
        path: ['points'],
        message: `must contain at least ${required === 4 ? 'four' : 'three'} included points with distinct pH values`,
      });
    }
    if (used.length > 0 && used.every((point) => point.k === 0)) {
      context.addIssue({ code: 'custom', path: ['points'], message: 'must contain at least one included non-zero rate constant' });
    }
  });
export type CreatePhProfileInput = z.infer<typeof createPhProfileInput>;

/** Query of GET /api/ph-profiles. */
export const phProfileListQuery = z.object({
  variantId: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1'),
});

/** One fitted pKa with the annotated residues that might own it. */
export interface PkaReadingDto {
  /** `pKa1` (acidic limb) or `pKa2` (basic limb). */
  parameter: 'pKa1' | 'pKa2';
  pKa: number;
  se: number | null;
  candidates: {
    position: number;
    residue: string;
    roles: string[];
    /** Free side-chain pKa (Dawson et al. 1986). */
    freePka: number;
    /** Fitted − free, pH units. */
    shift: number;
    /** The annotation's expected pKa in this enzyme, when one was entered. */
    expectedPka: number | null;
  }[];
}

/** A pH profile as the API returns it (rates in the SI unit of their kind). */
export interface PhProfileDto {
  id: number;
  variant: { id: number; label: string; campaignId: number };
  substrate: string;
  temperatureC: number;
  rateKind: PhRateKindName;
  unit: (typeof phRateSiUnit)[PhRateKindName];
  model: PhModelName;
  points: { ph: number; k: number; excluded: boolean }[];
  /** Acidic-limb pKa (bell and acid models). */
  pKa1: { value: number; se: number | null } | null;
  /** Basic-limb pKa (bell and base models). */
  pKa2: { value: number; se: number | null } | null;
  kMax: { value: number; se: number | null; unit: string };
  phOptimum: { value: number; se: number | null } | null;
  residualSd: number;
  degreesOfFreedom: number;
  warnings: string[];
  /** Present on GET /api/ph-profiles/:id. */
  pkaReading?: PkaReadingDto[];
  createdById: number | null;
  createdAt: string;
  version: number;
}
