import type { EntityManager } from 'typeorm';
import { ZERO_CELSIUS_KELVIN } from '@shared/kinetics/units';
import { canonicalConcentrationUnit, fromMolar, toMolar, type AssayConditionsDto, type ConcentrationUnitInput, type CreateAssayInput } from '@shared/schemas/assay';
import { badRequest } from '../../http/errors';
import { Campaign } from '../campaigns/campaign.entity';
import { Enzyme } from '../enzymes/enzyme.entity';
import { Variant } from '../variants/variant.entity';
import type { Assay } from './assay.entity';

// The API speaks °C, the database K; the modules converting between them import the offset from here.
export { ZERO_CELSIUS_KELVIN };

/** Cofactors that are metal ions: for these enzymes the metal salt is a required reporting item. */
const METAL_COFACTORS: readonly string[] = ['Zn2+', 'Mg2+', 'Mn2+', 'Fe2+', 'Cu2+'];

/** The variant a write refers to, with its campaign and the campaign's parent enzyme. */
export interface VariantContext {
  variant: Variant;
  campaign: Campaign;
  enzyme: Enzyme;
  /** Whether the enzyme needs a metal ion (so a metal salt belongs in the assay description). */
  metalCofactorRequired: boolean;
}

/**
 * Loads the variant named in a request body with its campaign and enzyme; an unknown id is bad input
 * (a 400 naming the field), not a missing resource.
 *
 * @param manager the transaction's entity manager
 * @param variantId the id from the body
 * @param field the body field, for the message
 * @throws {HttpError} 400 when there is no such variant
 * @returns the variant, campaign and enzyme
 */
export async function loadVariantContext(manager: EntityManager, variantId: number, field = 'variantId'): Promise<VariantContext> {
  const variant = await manager.getRepository(Variant).findOneBy({ id: variantId });
  if (!variant) throw badRequest(`There is no variant ${variantId}.`, { [field]: `no variant with id ${variantId}` });
  const campaign = await manager.getRepository(Campaign).findOneByOrFail({ id: variant.campaignId });
  const enzyme = await manager.getRepository(Enzyme).findOneByOrFail({ id: campaign.enzymeId });
  return {
    variant,
    campaign,
    enzyme,
    metalCofactorRequired: enzyme.cofactors.some((cofactor) => METAL_COFACTORS.includes(cofactor)),
  };
}

type ConditionInput = Pick<
  CreateAssayInput,
  'substrate' | 'temperatureC' | 'ph' | 'buffer' | 'ionicStrength' | 'metal' | 'otherComponents' | 'method' | 'detection' | 'assayDate' | 'notes'
> & { enzymeConcentration?: { value: number; unit: ConcentrationUnitInput } | null };

/**
 * The assay columns for a body's conditions, converted to SI (K, M); the enzyme concentration's unit is
 * kept in its canonical spelling so it can be shown as entered.
 *
 * @param input the validated conditions
 * @returns the column values of a new Assay
 */
export function assayConditionColumns(input: ConditionInput): Partial<Assay> {
  return {
    substrate: input.substrate,
    temperatureK: input.temperatureC + ZERO_CELSIUS_KELVIN,
    ph: input.ph,
    bufferName: input.buffer?.name ?? null,
    bufferMolar: input.buffer?.concentration ? toMolar(input.buffer.concentration.value, input.buffer.concentration.unit) : null,
    ionicStrengthMolar: input.ionicStrength ? toMolar(input.ionicStrength.value, input.ionicStrength.unit) : null,
    metalSalt: input.metal?.salt ?? null,
    metalMolar: input.metal ? toMolar(input.metal.concentration.value, input.metal.concentration.unit) : null,
    otherComponents: input.otherComponents ?? null,
    enzymeMolar: input.enzymeConcentration ? toMolar(input.enzymeConcentration.value, input.enzymeConcentration.unit) : null,
    enzymeUnit: input.enzymeConcentration ? canonicalConcentrationUnit(input.enzymeConcentration.unit) : null,
    method: input.method ?? null,
    detection: input.detection ?? null,
    assayDate: input.assayDate,
    notes: input.notes ?? null,
  };
}

/**
 * An assay's conditions as the API returns them: temperature in °C, concentrations in M, the enzyme
 * concentration also in the unit it was entered in.
 *
 * @param assay the stored assay
 * @returns the conditions DTO
 */
export function toAssayConditionsDto(assay: Assay): AssayConditionsDto {
  const enteredUnit = assay.enzymeUnit as ConcentrationUnitInput | null;
  return {
    substrate: assay.substrate,
    temperatureC: roundCelsius(assay.temperatureK - ZERO_CELSIUS_KELVIN),
    ph: assay.ph,
    buffer: assay.bufferName
      ? { name: assay.bufferName, concentration: assay.bufferMolar === null ? null : { value: assay.bufferMolar, unit: 'M' } }
      : null,
    ionicStrength: assay.ionicStrengthMolar === null ? null : { value: assay.ionicStrengthMolar, unit: 'M' },
    metal: assay.metalSalt
      ? { salt: assay.metalSalt, concentration: assay.metalMolar === null ? null : { value: assay.metalMolar, unit: 'M' } }
      : null,
    otherComponents: assay.otherComponents,
    enzymeConcentration:
      assay.enzymeMolar === null
        ? null
        : {
            value: assay.enzymeMolar,
            unit: 'M',
            entered: enteredUnit ? { value: fromMolar(assay.enzymeMolar, enteredUnit), unit: enteredUnit } : null,
          },
    method: assay.method,
    detection: assay.detection,
    assayDate: assay.assayDate,
  };
}

/**
 * °C from a stored kelvin value, rounded to 1e-9 °C so that 37 °C comes back as 37 and not
 * 37.00000000000006 (the K offset is not exact in binary).
 *
 * @param celsius the difference T − 273.15
 * @returns the rounded value
 */
export function roundCelsius(celsius: number): number {
  return Math.round(celsius * 1e9) / 1e9;
}
