import type { DataSource } from 'typeorm';
import { REPLICATES_ITEM } from '@shared/reporting/strenda-completeness';
import { notFound } from '../../http/errors';
import { roundCelsius, ZERO_CELSIUS_KELVIN } from '../assays/assay-conditions';
import type { Assay } from '../assays/assay.entity';
import { Campaign } from '../campaigns/campaign.entity';
import { queryByIds } from '../imports/import-lookups';
import { Measurement } from '../measurements/measurement.entity';
import type { OutputCell, OutputSheet } from './spreadsheet-writer';

/** The three tables of a campaign's measurement export. */
export const measurementExportSheets = ['measurements', 'rate-points', 'conditions'] as const;
export type MeasurementExportSheet = (typeof measurementExportSheets)[number];

// Conditions in the order and spelling the measurements and rate-points imports detect.
const CONDITION_HEADERS = [
  'Campaign',
  'Variant',
  'Substrate',
  'Temperature (°C)',
  'pH',
  'Buffer',
  'Buffer concentration (M)',
  'Ionic strength (M)',
  'Metal salt',
  'Metal concentration (M)',
  'Other components',
  'Enzyme concentration (M)',
  'Method',
  'Detection',
  'Assay date',
  'Notes',
] as const;

const MEASUREMENT_HEADERS = [
  ...CONDITION_HEADERS,
  'Model',
  'kcat (s⁻¹)',
  'kcat SE (s⁻¹)',
  'Km (M)',
  'Km SE (M)',
  'kcat/Km (M⁻¹ s⁻¹)',
  'kcat/Km SE (M⁻¹ s⁻¹)',
  'Ki (M)',
  'Ki SE (M)',
  'Hill n',
  'Hill n SE',
  'Lowest substrate concentration (M)',
  'Highest substrate concentration (M)',
  'Replicates',
  'Fitting method',
  'Source',
  'Review state',
  'Flags',
  'STRENDA completeness',
  'Measurement id',
  'Assay id',
];

const RATE_POINT_HEADERS = [...CONDITION_HEADERS, 'Model', 'Assay', '[S] (M)', 'v0 (M/s)', 'Replicate', 'Excluded', 'Exclusion reason'];

const CONDITIONS_SHEET_HEADERS = ['Assay', ...CONDITION_HEADERS, 'Replicates', 'Rate points', 'Entered S unit', 'Entered v0 unit'];

interface StoredPoint {
  assay_id: number;
  substrate_molar: number;
  rate_molar_per_second: number;
  replicate: number;
  excluded: number;
  exclusion_reason: string | null;
}

/**
 * A campaign's current measurements (not superseded by a refit; every review state, named in a column) as
 * three tables: the measurements with their conditions and parameters, the raw rate points of the assays
 * that have them, and one row of conditions per assay. Quantities are in the stored SI units, named in the
 * headers, so a re-import reads back the same numbers; temperature is in °C, as the API gives it; dates are
 * dates. The first two tables re-import as measurements and as raw rate points.
 *
 * @param dataSource the data source
 * @param campaignId the campaign
 * @throws {HttpError} 404 when there is no such campaign
 * @returns the three sheets
 */
export async function measurementExportSheetsOf(dataSource: DataSource, campaignId: number): Promise<Record<MeasurementExportSheet, OutputSheet>> {
  const campaign = await dataSource.getRepository(Campaign).findOne({ where: { id: campaignId }, select: { id: true, name: true } });
  if (!campaign) throw notFound('The campaign');
  const measurements = await dataSource
    .getRepository(Measurement)
    .createQueryBuilder('m')
    .innerJoinAndSelect('m.assay', 'a')
    .innerJoinAndSelect('m.variant', 'v')
    .where('v.campaignId = :campaignId', { campaignId })
    .andWhere('m.supersededById IS NULL')
    .orderBy('v.label', 'ASC')
    .addOrderBy('a.assayDate', 'ASC')
    .addOrderBy('a.id', 'ASC')
    .getMany();

  const withPoints = measurements.filter((measurement) => measurement.assay.sUnit !== null).map((measurement) => measurement.assayId);
  const points = await queryByIds<StoredPoint>(
    dataSource.manager,
    withPoints,
    `SELECT assay_id, substrate_molar, rate_molar_per_second, replicate, excluded, exclusion_reason FROM rate_points WHERE assay_id IN (?) ORDER BY assay_id, id`,
  );
  const pointsByAssay = new Map<number, StoredPoint[]>();
  for (const point of points) pointsByAssay.set(point.assay_id, [...(pointsByAssay.get(point.assay_id) ?? []), point]);

  const conditions = (measurement: Measurement): OutputCell[] => {
    const assay: Assay = measurement.assay;
    return [
      campaign.name,
      measurement.variant.label,
      assay.substrate,
      roundCelsius(assay.temperatureK - ZERO_CELSIUS_KELVIN),
      assay.ph,
      assay.bufferName,
      assay.bufferMolar,
      assay.ionicStrengthMolar,
      assay.metalSalt,
      assay.metalMolar,
      assay.otherComponents,
      assay.enzymeMolar,
      assay.method,
      assay.detection,
      new Date(`${assay.assayDate}T00:00:00Z`),
      assay.notes,
    ];
  };
  const replicates = (measurement: Measurement) => (measurement.completenessMissing.includes(REPLICATES_ITEM) ? null : measurement.assay.replicateCount);

  const measurementRows = measurements.map((measurement): OutputCell[] => [
    ...conditions(measurement),
    measurement.model,
    measurement.kcat,
    measurement.kcatSe,
    measurement.km,
    measurement.kmSe,
    measurement.kcatOverKm,
    measurement.kcatOverKmSe,
    measurement.ki,
    measurement.kiSe,
    measurement.hillN,
    measurement.hillNSe,
    measurement.substrateMinMolar,
    measurement.substrateMaxMolar,
    replicates(measurement),
    measurement.fittingMethod,
    measurement.source,
    measurement.reviewState,
    measurement.flags.map((flag) => flag.code).join(', ') || null,
    measurement.completenessScore,
    measurement.id,
    measurement.assayId,
  ]);

  const pointRows: OutputCell[][] = [];
  for (const measurement of measurements) {
    for (const point of pointsByAssay.get(measurement.assayId) ?? []) {
      pointRows.push([
        ...conditions(measurement),
        measurement.model,
        measurement.assayId,
        point.substrate_molar,
        point.rate_molar_per_second,
        point.replicate,
        point.excluded === 1,
        point.exclusion_reason,
      ]);
    }
  }

  const conditionRows = measurements.map((measurement): OutputCell[] => [
    measurement.assayId,
    ...conditions(measurement),
    replicates(measurement),
    pointsByAssay.get(measurement.assayId)?.length ?? 0,
    measurement.assay.sUnit,
    measurement.assay.vUnit,
  ]);

  return {
    measurements: { name: 'Measurements', headers: MEASUREMENT_HEADERS, rows: measurementRows },
    'rate-points': { name: 'Rate points', headers: RATE_POINT_HEADERS, rows: pointRows },
    conditions: { name: 'Conditions', headers: CONDITIONS_SHEET_HEADERS, rows: conditionRows },
  };
}
