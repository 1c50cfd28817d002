import type { DataSource } from 'typeorm';
import type { ReviewAction } from '@shared/schemas/measurement';
import { createAssayInput } from '@shared/schemas/assay';
import { createCampaignInput } from '@shared/schemas/campaign';
import { createEnzymeInput } from '@shared/schemas/enzyme';
import { createPhProfileInput } from '@shared/schemas/ph-profile';
import { createVariantInput } from '@shared/schemas/variant';
import { createAssay } from '../modules/assays/assays.service';
import { createCampaign } from '../modules/campaigns/campaigns.service';
import { createEnzyme } from '../modules/enzymes/enzymes.service';
import { reviewMeasurement } from '../modules/measurements/measurements.service';
import { createPhProfile } from '../modules/ph-profiles/ph-profiles.service';
import { User } from '../modules/users/user.entity';
import { createVariant } from '../modules/variants/variants.service';
import { Variant } from '../modules/variants/variant.entity';
import { bellFraction, demoConditions, demoParent, demoSequence, demoSites, demoVariantPlans, type DemoVariantPlan } from './demo-scenario';
import { seededRandom, type SeededRandom } from './seeded-random';

const substrateMillimolar = [0.1, 0.2, 0.4, 0.8, 1.6, 3.2, 6.4, 12.8, 25.6];
const phSeries = [4, 4.5, 5, 5.5, 6, 6.5, 7, 7.5, 8, 8.5, 9, 9.5, 10];

interface Actors {
  lead: number;
  kineticist: number;
  biologist: number;
}

interface Kinetics {
  kcatPerSecond: number;
  kmMolar: number;
  pka1: number;
}

/**
 * Writes the invented demo campaign through the same services the API uses, so every number (fits,
 * comparisons, summaries, audit trail) is produced exactly as for real data.
 */
export async function seedDemoCampaign(dataSource: DataSource): Promise<void> {
  const random = seededRandom(42);
  const actors = await findActors(dataSource);

  const enzyme = await createEnzyme(
    dataSource,
    actors.biologist,
    createEnzymeInput.parse({
      name: 'Ardentimonas amidase AmdT',
      ecNumber: '3.5.1.4',
      organism: 'Ardentimonas caldaria (fictional thermophile)',
      sequence: demoSequence(),
      cofactors: ['Zn2+'],
      sites: demoSites.map(({ position, residue, role, expectedPka, note }) => ({ position, residue, role, expectedPka, note })),
    }),
  );

  const campaign = await createCampaign(
    dataSource,
    actors.lead,
    createCampaignInput.parse({
      name: 'AmdT acid tolerance, round 2',
      objective: 'Raise kcat/Km at pH 5.5 (45 °C) at least threefold over the parent without losing thermostability, by lowering the pKa of the general base H190 through second-shell changes.',
      enzymeId: enzyme.id,
      targetSubstrate: demoConditions.substrate,
      targetPh: demoConditions.target.ph,
      targetTemperatureC: demoConditions.target.temperatureC,
      leadId: actors.lead,
    }),
  );

  const parent = await dataSource.getRepository(Variant).findOneByOrFail({ campaignId: campaign.id, mutationCount: 0 });
  const parentKinetics: Kinetics = { kcatPerSecond: demoParent.kcatPerSecond, kmMolar: demoParent.kmMolar, pka1: demoParent.pka1 };
  let day = 0;
  const nextDate = () => {
    day += 1;
    return new Date(Date.UTC(2026, 9, 1 + Math.floor(day / 3))).toISOString().slice(0, 10);
  };

  // The parent, measured repeatedly at the target conditions and at the reference pH.
  const parentMeasurements: number[] = [];
  for (let replicate = 0; replicate < 3; replicate += 1) {
    parentMeasurements.push(await addAssay(dataSource, actors, random, parent.id, parentKinetics, demoConditions.target, nextDate()));
  }
  parentMeasurements.push(await addAssay(dataSource, actors, random, parent.id, parentKinetics, demoConditions.reference, nextDate()));
  await addPhProfile(dataSource, actors, random, parent.id, parentKinetics);
  await review(dataSource, actors, parentMeasurements, ['submit', 'approve']);

  const byLabel = new Map<string, number>();
  for (const [index, plan] of demoVariantPlans().entries()) {
    const lineageParent = plan.mutations.includes('/') ? byLabel.get(plan.mutations.split('/')[0]) : undefined;
    const variant = await createVariant(
      dataSource,
      actors.biologist,
      createVariantInput.parse({
        campaignId: campaign.id,
        mutations: plan.mutations,
        parentVariantId: lineageParent ?? null,
        constructId: plan.constructId,
        status: plan.status,
        notes: plan.notes,
      }),
    );
    byLabel.set(variant.label, variant.id);
    if (plan.status !== 'characterized') continue;
    const kinetics = variantKinetics(plan);
    const measurementIds = [await addAssay(dataSource, actors, random, variant.id, kinetics, demoConditions.target, nextDate())];
    // Most variants get a second replicate at the target; catalytic-site singles also at pH 7.5.
    if (index % 4 !== 3) measurementIds.push(await addAssay(dataSource, actors, random, variant.id, kinetics, demoConditions.target, nextDate()));
    if (index < 9) measurementIds.push(await addAssay(dataSource, actors, random, variant.id, kinetics, demoConditions.reference, nextDate()));
    if (plan.phProfile) await addPhProfile(dataSource, actors, random, variant.id, kinetics);

    // A realistic spread of review states: most approved, some waiting for the lead, a few drafts.
    if (index % 7 === 5) continue;
    if (index % 5 === 2) await review(dataSource, actors, measurementIds, ['submit']);
    else await review(dataSource, actors, measurementIds, ['submit', 'approve']);
  }

  // One flagged and one retracted measurement, with the reasons a lead and a kineticist would give.
  const flagTarget = byLabel.get('R215E');
  const retractTarget = byLabel.get('W160F');
  if (flagTarget) await flagLatest(dataSource, actors, flagTarget, 'flag', 'The substrate range stops well short of 5 × Km, so kcat and Km are extrapolated; repeat with substrate up to 100 mM.');
  if (retractTarget) await flagLatest(dataSource, actors, retractTarget, 'retract', 'Enzyme stock concentration was mis-entered (wrong extinction coefficient); the measurement at pH 5.5, from the other stock, stands.');
}

async function findActors(dataSource: DataSource): Promise<Actors> {
  const users = await dataSource.getRepository(User).find();
  const idOf = (email: string) => {
    const user = users.find((candidate) => candidate.email === email);
    if (!user) throw new Error(`The demo campaign needs the demo account ${email}.`);
    return user.id;
  };
  return { lead: idOf('lead@kcatalog.example'), kineticist: idOf('kineticist@kcatalog.example'), biologist: idOf('biologist@kcatalog.example') };
}

function variantKinetics(plan: DemoVariantPlan): Kinetics {
  return {
    kcatPerSecond: demoParent.kcatPerSecond * plan.kcatFactor,
    kmMolar: demoParent.kmMolar * plan.kmFactor,
    pka1: demoParent.pka1 + plan.pka1Shift,
  };
}

/** One assay of 9 substrate concentrations in duplicate, generated from the model with 5 % noise. */
async function addAssay(
  dataSource: DataSource,
  actors: Actors,
  random: SeededRandom,
  variantId: number,
  kinetics: Kinetics,
  conditions: { ph: number; temperatureC: number },
  assayDate: string,
): Promise<number> {
  const kcatAtPh = kinetics.kcatPerSecond * bellFraction(conditions.ph, kinetics.pka1, demoParent.pka2) / bellFraction(7.5, demoParent.pka1, demoParent.pka2);
  // Slow variants are assayed with more enzyme, as a kineticist would, to keep the rates measurable.
  const enzymeNanomolar = kcatAtPh < 0.05 ? 2000 : kcatAtPh < 1 ? 100 : 10;
  const vmaxMicromolarPerMinute = kcatAtPh * enzymeNanomolar * 1e-3 * 60;
  const points = substrateMillimolar.flatMap((s) =>
    [1, 2].map((replicate) => {
      const v = (vmaxMicromolarPerMinute * s) / (kinetics.kmMolar * 1e3 + s);
      return { s, v: Math.max(0, v * (1 + 0.05 * random.normal()) + 0.002 * vmaxMicromolarPerMinute * random.normal()), replicate };
    }),
  );
  const result = await createAssay(
    dataSource,
    actors.kineticist,
    createAssayInput.parse({
      variantId,
      substrate: demoConditions.substrate,
      temperatureC: conditions.temperatureC,
      ph: conditions.ph,
      buffer: { name: conditions.ph < 6.5 ? 'MES' : 'HEPES', concentration: { value: 50, unit: 'mM' } },
      ionicStrength: { value: 100, unit: 'mM' },
      metal: { salt: 'ZnCl2', concentration: { value: 10, unit: 'µM' } },
      enzymeConcentration: { value: enzymeNanomolar, unit: 'nM' },
      method: 'continuous',
      detection: 'absorbance at 405 nm (4-nitroaniline released)',
      assayDate,
      points,
      sUnit: 'mM',
      vUnit: 'µM/min',
      model: 'michaelis-menten',
    }),
  );
  return result.measurement.id;
}

async function addPhProfile(dataSource: DataSource, actors: Actors, random: SeededRandom, variantId: number, kinetics: Kinetics): Promise<void> {
  const plateau = kinetics.kcatPerSecond / kinetics.kmMolar / bellFraction(7.5, demoParent.pka1, demoParent.pka2);
  await createPhProfile(
    dataSource,
    actors.kineticist,
    createPhProfileInput.parse({
      variantId,
      substrate: demoConditions.substrate,
      temperatureC: demoConditions.target.temperatureC,
      rateKind: 'kcatOverKm',
      unit: 'M⁻¹ s⁻¹',
      model: 'bell',
      points: phSeries.map((ph) => ({ ph, k: plateau * bellFraction(ph, kinetics.pka1, demoParent.pka2) * (1 + 0.04 * random.normal()) })),
    }),
  );
}

async function review(dataSource: DataSource, actors: Actors, measurementIds: readonly number[], actions: readonly ReviewAction[]): Promise<void> {
  for (const id of measurementIds) {
    let version = 1;
    for (const action of actions) {
      const actor = action === 'submit' ? { id: actors.kineticist, role: 'kineticist' as const } : { id: actors.lead, role: 'lead' as const };
      version = (await reviewMeasurement(dataSource, actor, id, { version, action, reason: null })).version;
    }
  }
}

async function flagLatest(dataSource: DataSource, actors: Actors, variantId: number, action: 'flag' | 'retract', reason: string): Promise<void> {
  const [latest] = (await dataSource.query(`SELECT id, version, review_state AS state FROM measurements WHERE variant_id = ? ORDER BY id DESC LIMIT 1`, [variantId])) as {
    id: number;
    version: number;
    state: string;
  }[];
  if (!latest) return;
  const actor = action === 'flag' ? { id: actors.lead, role: 'lead' as const } : { id: actors.kineticist, role: 'kineticist' as const };
  let version = latest.version;
  if (action === 'flag' && latest.state === 'draft') {
    version = (await reviewMeasurement(dataSource, { id: actors.kineticist, role: 'kineticist' }, latest.id, { version, action: 'submit', reason: null })).version;
  }
  await reviewMeasurement(dataSource, actor, latest.id, { version, action, reason });
}
