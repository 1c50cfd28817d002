import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CombinedRatesDto, ConditionComparisonDto, VariantComparisonDto } from '@shared/schemas/comparison';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { Notice } from '@/components/ui/notice';
import { EmptyState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { formatEnergy, formatPh } from '@/lib/format';
import { formatKcatOverKmWithSe, formatKcatWithSe, formatKmWithSe, formatRatioWithSe, kmUnitFor } from '../format-estimates';
import { KcatOverKmSymbol, KcatSymbol, KmSymbol } from './rate-symbols';

interface ComparisonPanelProps {
  comparison: VariantComparisonDto;
  /** The parent variant's measurements, to say under which conditions each matched one was run. */
  parentMeasurements: readonly MeasurementDto[] | undefined;
  unit: EnergyUnit;
}

/**
 * The variant against the campaign's parent, one card per condition group of its counted measurements,
 * the primary group (target substrate, nearest the target conditions) first.
 */
export function ComparisonPanel({ comparison, parentMeasurements, unit }: ComparisonPanelProps) {
  if (comparison.comparisons.length === 0) {
    return (
      <EmptyState title="Nothing to compare yet.">
        This variant has no counted measurement (draft, submitted or approved). Flagged and retracted measurements are left out.
      </EmptyState>
    );
  }
  const parentById = new Map((parentMeasurements ?? []).map((measurement) => [measurement.id, measurement]));
  return (
    <div className="space-y-4">
      {comparison.variant.isParent ? (
        <p className="text-sm text-ink-600">
          The parent&apos;s own measurements, combined per set of conditions: every variant is compared with these. Target:{' '}
          {comparison.target.substrate}, {comparison.target.temperatureC} °C, pH {formatPh(comparison.target.ph)}.
        </p>
      ) : (
        <p className="text-sm text-ink-600">
          ΔΔG‡ = −RT ln(k<sub>variant</sub>/k<sub>parent</sub>) at the assay temperature: negative means faster than the parent. Parent
          measurements count as matched with the same substrate, within 0.5 °C and 0.1 pH of every measurement in the group. Target:{' '}
          {comparison.target.substrate}, {comparison.target.temperatureC} °C, pH {formatPh(comparison.target.ph)}.
        </p>
      )}
      {comparison.comparisons.map((group, index) => (
        <ConditionGroupCard
          key={`${group.substrate}-${group.temperatureC}-${group.ph}-${group.measurementIds.join(',')}`}
          group={group}
          primary={index === 0}
          isParent={comparison.variant.isParent}
          parentVariant={comparison.parentVariant}
          parentById={parentById}
          unit={unit}
        />
      ))}
    </div>
  );
}

interface ConditionGroupCardProps {
  group: ConditionComparisonDto;
  primary: boolean;
  isParent: boolean;
  parentVariant: { id: number; label: string } | null;
  parentById: ReadonlyMap<number, MeasurementDto>;
  unit: EnergyUnit;
}

function ConditionGroupCard({ group, primary, isParent, parentVariant, parentById, unit }: ConditionGroupCardProps) {
  const heading = `${group.substrate} · ${formatTemperature(group.temperatureC)} · pH ${formatPh(group.ph)}`;
  return (
    <article
      aria-label={`${primary ? 'Primary comparison' : 'Comparison'}: ${heading}`}
      className={`rounded-lg border bg-white p-4 ${primary ? 'border-lagoon-500 shadow-card' : 'border-paper-200'}`}
    >
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="font-semibold text-ink-900">
          {primary && <span className="mr-2 rounded bg-lagoon-700 px-1.5 py-0.5 text-xs font-semibold uppercase tracking-wide text-white">Primary</span>}
          {heading}
        </h3>
        <p className="text-xs text-ink-600">
          {group.onTargetSubstrate ? 'target substrate' : 'not the target substrate'} · {distanceText(group.targetDistance)}
        </p>
      </header>

      {!group.matched ? (
        <div className="mt-3">
          <Notice tone="caution" title="No comparison under these conditions">
            <p>{sentenceCase(group.reason ?? 'no matched parent measurement')}.</p>
            <p className="mt-1">
              This variant&apos;s measurements: {measurementList(group.measurementIds)}. Measure the parent under the same conditions to compare.
            </p>
          </Notice>
        </div>
      ) : (
        <>
          {!isParent && (
            <dl className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-3">
              <Figure term={<>ΔΔG‡ for <KcatOverKmSymbol /></>} value={group.ddgKcatOverKm ? formatEnergy(group.ddgKcatOverKm.kJPerMol.value, group.ddgKcatOverKm.kJPerMol.se, unit) : '—'} strong />
              <Figure term={<>ΔΔG‡ for <KcatSymbol /></>} value={group.ddgKcat ? formatEnergy(group.ddgKcat.kJPerMol.value, group.ddgKcat.kJPerMol.se, unit) : '—'} strong />
              <Figure term={<>Fold change in <KcatOverKmSymbol /></>} value={group.foldChange ? `${formatRatioWithSe(group.foldChange)}×` : '—'} />
              <Figure term={<><KcatSymbol /> ratio, variant/parent</>} value={formatRatioWithSe(group.kcatRatio)} />
              <Figure term={<><KmSymbol /> ratio, variant/parent</>} value={formatRatioWithSe(group.kmRatio)} />
            </dl>
          )}
          <RatesTable variant={group.variant} parent={isParent ? null : group.parent} />
          <div className="mt-3 space-y-1 text-sm text-ink-700">
            <p>
              {isParent ? 'The parent is its own reference; its measurements here: ' : 'This variant: '}
              {measurementList(group.measurementIds)}.
            </p>
            {!isParent && (
              <div>
                <p>
                  Matched to {group.parentMeasurementIds.length === 1 ? 'parent measurement' : `${group.parentMeasurementIds.length} parent measurements`}
                  {parentVariant && (
                    <>
                      {' '}
                      of{' '}
                      <Link to={paths.variant.href(parentVariant.id)} className="font-mono text-lagoon-700 underline-offset-2 hover:underline">
                        {parentVariant.label}
                      </Link>
                    </>
                  )}
                  :
                </p>
                <ul className="mt-1 list-inside list-disc text-ink-600">
                  {group.parentMeasurementIds.map((id) => (
                    <li key={id}>{describeParentMeasurement(id, parentById.get(id))}</li>
                  ))}
                </ul>
              </div>
            )}
          </div>
        </>
      )}
      {group.notes.length > 0 && (
        <ul className="mt-3 space-y-1 text-sm text-signal-caution">
          {group.notes.map((note) => (
            <li key={note} className="flex gap-1.5">
              <span aria-hidden>!</span>
              <span>
                <span className="sr-only">Note: </span>
                {note}
              </span>
            </li>
          ))}
        </ul>
      )}
    </article>
  );
}

function Figure({ term, value, strong = false }: { term: ReactNode; value: string; strong?: boolean }) {
  return (
    <div className="rounded-md bg-paper-50 px-3 py-2">
      <dt className="text-xs font-medium text-ink-600">{term}</dt>
      <dd className={`font-mono tabular-nums ${strong ? 'text-base font-semibold text-ink-900' : 'text-sm text-ink-900'}`}>{value}</dd>
    </div>
  );
}

function RatesTable({ variant, parent }: { variant: CombinedRatesDto; parent: CombinedRatesDto | null }) {
  const kmUnit = kmUnitFor([variant.km?.value, parent?.km?.value]);
  const rows = [
    { name: <KcatSymbol />, key: 'kcat', variant: formatKcatWithSe(variant.kcat), variantN: variant.kcat?.n, parent: parent && formatKcatWithSe(parent.kcat), parentN: parent?.kcat?.n },
    { name: <KmSymbol />, key: 'km', variant: formatKmWithSe(variant.km, kmUnit), variantN: variant.km?.n, parent: parent && formatKmWithSe(parent.km, kmUnit), parentN: parent?.km?.n },
    {
      name: <KcatOverKmSymbol />,
      key: 'kcatOverKm',
      variant: formatKcatOverKmWithSe(variant.kcatOverKm),
      variantN: variant.kcatOverKm?.n,
      parent: parent && formatKcatOverKmWithSe(parent.kcatOverKm),
      parentN: parent?.kcatOverKm?.n,
    },
  ];
  return (
    <table className="mt-3 w-full text-sm">
      <caption className="sr-only">Combined rate constants (inverse-variance weighted mean ± SE)</caption>
      <thead className="text-xs uppercase tracking-wide text-ink-600">
        <tr className="border-b border-paper-200">
          <th scope="col" className="py-1 pr-3 text-left font-semibold">Weighted mean ± SE</th>
          <th scope="col" className="py-1 pr-3 text-right font-semibold">This variant</th>
          {parent && <th scope="col" className="py-1 text-right font-semibold">Parent</th>}
        </tr>
      </thead>
      <tbody className="divide-y divide-paper-100">
        {rows.map((row) => (
          <tr key={row.key}>
            <th scope="row" className="py-1 pr-3 text-left font-normal text-ink-700">
              {row.name}
            </th>
            <td className="numeric py-1 pr-3 font-mono">
              {row.variant}
              {row.variantN !== undefined && <span className="ml-1 text-xs text-ink-500">(n = {row.variantN})</span>}
            </td>
            {parent && (
              <td className="numeric py-1 font-mono">
                {row.parent}
                {row.parentN !== undefined && <span className="ml-1 text-xs text-ink-500">(n = {row.parentN})</span>}
              </td>
            )}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function describeParentMeasurement(id: number, measurement: MeasurementDto | undefined): string {
  if (!measurement) return `measurement ${id}`;
  const { conditions } = measurement;
  const buffer = conditions.buffer
    ? `, ${conditions.buffer.name}${conditions.buffer.concentration ? ` ${formatMillimolar(conditions.buffer.concentration.value)}` : ''}`
    : '';
  return `measurement ${id}: ${conditions.substrate}, ${formatTemperature(conditions.temperatureC)}, pH ${formatPh(conditions.ph)}${buffer}, assayed ${conditions.assayDate}`;
}

const sentenceCase = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

function measurementList(ids: readonly number[]): string {
  return `${ids.length === 1 ? 'measurement' : 'measurements'} ${ids.join(', ')}`;
}

function formatTemperature(celsius: number): string {
  return `${Number(celsius.toFixed(1))} °C`;
}

function formatMillimolar(molar: number): string {
  return `${Number((molar * 1e3).toPrecision(3))} mM`;
}

function distanceText(distance: number): string {
  if (distance <= 1) return 'at the target conditions';
  return `${distance.toFixed(1)} tolerances from the target conditions`;
}
