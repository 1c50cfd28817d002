import { useId, useMemo, useState } from 'react';
import { fitAssay } from '@shared/assay/fit-assay';
import { fitPhProfile } from '@shared/kinetics/fit-ph-profile';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import type { FitResult } from '@shared/kinetics/types';
import type { AssayDto, ConcentrationUnitInput, KineticModelName, RateUnitInput } from '@shared/schemas/assay';
import type { PhProfileDto } from '@shared/schemas/ph-profile';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { formatKcat, formatKm, formatPh } from '@/lib/format';
import { useAssay } from '../api/get-assay';
import { useAssayFiles } from '../api/get-assay-files';
import { usePhProfiles } from '../api/get-ph-profiles';
import { useVariantAssays } from '../api/get-variant-assays';
import { useVariantComparison } from '../api/get-variant-comparison';
import { AssayFitCharts } from './assay-fit-charts';
import { ParentComparisonChart } from './parent-comparison-chart';
import { PhProfileChart } from './ph-profile-chart';

const MODEL_LABELS: Record<KineticModelName, string> = {
  'michaelis-menten': 'Michaelis–Menten fit',
  'substrate-inhibition': 'Substrate-inhibition fit',
  hill: 'Hill fit',
};
const PH_MODEL_LABELS = { bell: 'Bell-shaped fit', acid: 'Acid-limb fit', base: 'Base-limb fit' } as const;
const RATE_KIND_LABELS = { kcat: 'kcat', kcatOverKm: 'kcat/Km', v0: 'v₀' } as const;

/**
 * The Variant page's charts: the Michaelis–Menten plot and residuals of a chosen assay, the newest pH
 * profile with its pKa values and optimum, and the variant against its condition-matched parent.
 */
export function VariantCharts({ variantId, variantLabel }: { variantId: number; variantLabel: string }) {
  const assays = useVariantAssays(variantId);
  const profiles = usePhProfiles(variantId);
  const comparison = useVariantComparison(variantId);
  const fitted = useMemo(() => (assays.data?.items ?? []).filter((assay) => assay.sUnit !== null && assay.vUnit !== null && assay.pointCount > 0), [assays.data]);
  const [chosen, setChosen] = useState<number | null>(null);
  const assayId = chosen ?? fitted[0]?.id ?? null;
  const selectId = useId();

  return (
    <div className="space-y-4">
      <div className="space-y-2">
        {assays.isPending && <LoadingState label="Loading assays…" />}
        {assays.isError && <ErrorState error={assays.error} onRetry={() => void assays.refetch()} />}
        {assays.data && fitted.length === 0 && <EmptyState title="No assay with rate points yet.">The Michaelis–Menten plot appears once an assay is entered from raw rates.</EmptyState>}
        {fitted.length > 1 && (
          <div className="flex flex-wrap items-center gap-2 text-sm">
            <label htmlFor={selectId} className="font-medium text-ink-700">
              Assay
            </label>
            <select
              id={selectId}
              value={assayId ?? ''}
              onChange={(event) => setChosen(Number(event.target.value))}
              className="rounded-md border border-paper-300 bg-white px-2 py-1 text-sm focus:border-lagoon-500 focus:outline-none focus:ring-2 focus:ring-lagoon-200"
            >
              {fitted.map((assay) => (
                <option key={assay.id} value={assay.id}>
                  {`${assay.conditions.assayDate} · ${assay.conditions.substrate}, pH ${assay.conditions.ph}, ${assay.conditions.temperatureC} °C · ${assay.pointCount} points`}
                </option>
              ))}
            </select>
          </div>
        )}
        {assayId !== null && <StoredAssayCharts assayId={assayId} variantLabel={variantLabel} />}
      </div>
      <div className="grid gap-4 xl:grid-cols-2">
        <div>
          {profiles.isPending && <LoadingState label="Loading pH profiles…" />}
          {profiles.isError && <ErrorState error={profiles.error} onRetry={() => void profiles.refetch()} />}
          {profiles.data && profiles.data.length === 0 && <EmptyState title="No pH profile yet." />}
          {profiles.data && profiles.data.length > 0 && <StoredPhProfileChart profile={profiles.data[0]} variantLabel={variantLabel} />}
        </div>
        <div>
          {comparison.isPending && <LoadingState label="Comparing with the parent…" />}
          {comparison.isError && <ErrorState error={comparison.error} onRetry={() => void comparison.refetch()} />}
          {comparison.data?.variant.isParent && <EmptyState title="This is the parent.">Every other variant of the campaign is compared with it.</EmptyState>}
          {comparison.data && !comparison.data.variant.isParent && !comparison.data.primary?.matched && (
            <EmptyState title="No condition-matched parent measurement.">{comparison.data.primary?.reason ?? 'This variant has no counted measurement yet.'}</EmptyState>
          )}
          {comparison.data && !comparison.data.variant.isParent && comparison.data.primary?.matched && (
            <ParentComparisonChart comparison={comparison.data.primary} variantLabel={variantLabel} parentLabel={comparison.data.parentVariant?.label ?? 'parent'} />
          )}
        </div>
      </div>
    </div>
  );
}

/** Refits a stored assay's points in the browser (same code as the server) to draw its curve and band. */
function refit(assay: AssayDto, model: KineticModelName): FitResult | null {
  const entered = assay.conditions.enzymeConcentration?.entered;
  const enzymeConcentration = entered ? { value: entered.value, unit: entered.unit as ConcentrationUnitInput } : { value: assay.conditions.enzymeConcentration?.value ?? 1, unit: 'M' as const };
  try {
    return fitAssay(
      (assay.points ?? []).map((point) => ({ s: point.s, v: point.v, excluded: point.excluded })),
      { model, sUnit: assay.sUnit as ConcentrationUnitInput, vUnit: assay.vUnit as RateUnitInput, enzymeConcentration },
    ).fit;
  } catch (error) {
    if (error instanceof KineticsInputError) return null;
    throw error;
  }
}

function StoredAssayCharts({ assayId, variantLabel }: { assayId: number; variantLabel: string }) {
  const assay = useAssay(assayId);
  const data = assay.data;
  const current = data?.measurements.find((measurement) => measurement.id === data.currentMeasurementId) ?? null;
  const model = current?.model ?? 'michaelis-menten';
  const fit = useMemo(() => (data ? refit(data, model) : null), [data, model]);
  const points = useMemo(
    () => (data?.points ?? []).map((point) => ({ key: String(point.id), s: point.s, v: point.v, replicate: point.replicate, excluded: point.excluded, reason: point.exclusionReason })),
    [data],
  );
  if (assay.isPending) return <LoadingState label="Loading the rate points…" />;
  if (assay.isError) return <ErrorState error={assay.error} onRetry={() => void assay.refetch()} />;
  const stored = current
    ? `Stored: kcat ${formatKcat(current.kcat?.value)}, Km ${formatKm(current.km?.value)} (${current.reviewState}); assay of ${assay.data.conditions.assayDate}.`
    : `Assay of ${assay.data.conditions.assayDate}.`;
  return (
    <div className="space-y-2">
      <AssayFitCharts points={points} fit={fit} curveLabel={MODEL_LABELS[model]} sUnit={assay.data.sUnit ?? ''} vUnit={assay.data.vUnit ?? ''} subject={variantLabel} subtitle={stored} />
      <AssayFiles assayId={assayId} />
    </div>
  );
}

/** The raw instrument files behind an assay, as downloads with their SHA-256. */
function AssayFiles({ assayId }: { assayId: number }) {
  const files = useAssayFiles(assayId);
  if (files.isError) return <ErrorState error={files.error} onRetry={() => void files.refetch()} />;
  if (!files.data || files.data.length === 0) return null;
  return (
    <div className="rounded-lg border border-paper-200 bg-white px-4 py-3 text-sm">
      <h3 className="font-medium text-ink-700">Raw files of this assay</h3>
      <ul className="mt-1 space-y-0.5">
        {files.data.map((file) => (
          <li key={file.id} className="flex flex-wrap justify-between gap-2">
            <a href={file.contentUrl} className="font-mono text-xs text-lagoon-700 underline-offset-2 hover:underline">
              {file.originalName}
            </a>
            <span className="font-mono text-xs text-ink-500" title={`SHA-256 ${file.sha256}`}>
              {file.sizeBytes.toLocaleString('en-US')} bytes · SHA-256 {file.sha256.slice(0, 16)}…
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}

function StoredPhProfileChart({ profile, variantLabel }: { profile: PhProfileDto; variantLabel: string }) {
  const fit = useMemo(() => {
    try {
      return fitPhProfile(
        profile.points.filter((point) => !point.excluded).map((point) => ({ ph: point.ph, k: point.k })),
        { model: profile.model },
      );
    } catch (error) {
      if (error instanceof KineticsInputError) return null;
      throw error;
    }
  }, [profile]);
  const pkas = [
    ...(profile.pKa1 ? [{ label: 'pKa1', value: profile.pKa1.value, se: profile.pKa1.se }] : []),
    ...(profile.pKa2 ? [{ label: 'pKa2', value: profile.pKa2.value, se: profile.pKa2.se }] : []),
  ];
  return (
    <PhProfileChart
      points={profile.points.map((point, index) => ({ key: String(index), ph: point.ph, k: point.k, excluded: point.excluded }))}
      fit={fit}
      curveLabel={PH_MODEL_LABELS[profile.model]}
      rateTitle={`${RATE_KIND_LABELS[profile.rateKind]} (${profile.unit})`}
      pkas={pkas}
      optimum={profile.phOptimum ? { label: 'pH optimum', value: profile.phOptimum.value, se: profile.phOptimum.se } : null}
      subject={variantLabel}
      subtitle={`${profile.substrate}, ${profile.temperatureC} °C${profile.phOptimum ? `; optimum pH ${formatPh(profile.phOptimum.value)}` : ''}.`}
    />
  );
}
