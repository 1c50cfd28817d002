import { useQueries, useQueryClient } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import type { MeasurementDto } from '@shared/schemas/measurement';
import type { VariantDto } from '@shared/schemas/variant';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useEnergyUnit } from '@/features/auth/api/update-preferences';
import { EnergyUnitToggle } from '@/features/auth/components/energy-unit-toggle';
import { VariantCharts } from '@/features/charts/components/variant-charts';
import { getCampaignQueryOptions } from '@/features/campaigns/api/get-campaign';
import { useEnzyme } from '@/features/enzymes/api/get-enzyme';
import { SequenceMap } from '@/features/sequence-map/components/sequence-map';
import { useCampaignCycles } from '@/features/variants/api/get-campaign-cycles';
import { getVariantQueryOptions, useVariant } from '@/features/variants/api/get-variant';
import { useVariantComparison } from '@/features/variants/api/get-variant-comparison';
import { useVariantMeasurements } from '@/features/variants/api/get-variant-measurements';
import { getVariantsQueryOptions } from '@/features/variants/api/get-variants';
import { ComparisonPanel } from '@/features/variants/components/comparison-panel';
import { CompletenessPanel } from '@/features/variants/components/completeness-panel';
import { CyclesPanel } from '@/features/variants/components/cycles-panel';
import { DetailsPanel } from '@/features/variants/components/details-panel';
import { LineagePanel } from '@/features/variants/components/lineage-panel';
import { MeasurementsTable } from '@/features/variants/components/measurements-table';
import { MutationsPanel } from '@/features/variants/components/mutations-panel';
import { StatusPanel } from '@/features/variants/components/status-panel';
import { VariantStatusBadge } from '@/features/variants/components/variant-status-badge';

// Variants named in the hover details of one mutated position; the registry lists the rest.
const variantsPerPosition = 50;

function Section({ id, title, description, actions, children }: { id: string; title: string; description?: ReactNode; actions?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h2 id={`${id}-heading`} className="text-lg font-semibold text-ink-900">
            {title}
          </h2>
          {description && <p className="text-sm text-ink-600">{description}</p>}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}

function Card({ title, children }: { title: string; children: ReactNode }) {
  return (
    <section aria-label={title} className="rounded-lg border border-paper-200 bg-white p-4 shadow-card">
      <h2 className="mb-3 text-sm font-semibold uppercase tracking-wide text-ink-700">{title}</h2>
      {children}
    </section>
  );
}

export default function VariantRoute() {
  const variantId = Number(useParams().id);
  const me = useMe();
  const [unit] = useEnergyUnit();
  const queryClient = useQueryClient();
  const variant = useVariant(variantId);
  const comparison = useVariantComparison(variantId);
  const measurements = useVariantMeasurements(variantId);
  const enzyme = useEnzyme(variant.data?.enzymeId);
  const cycles = useCampaignCycles(variant.data?.campaignId);
  const parentVariantId = comparison.data && !comparison.data.variant.isParent ? comparison.data.parentVariant?.id : undefined;
  const parentMeasurements = useVariantMeasurements(parentVariantId);

  const positions = variant.data?.mutations.map((mutation) => mutation.position) ?? [];
  const neighbours = useQueries({
    queries: positions.map((position) =>
      getVariantsQueryOptions({ campaignId: variant.data?.campaignId, position, sort: 'label', pageSize: variantsPerPosition }),
    ),
  });
  const variantsByPosition = new Map<number, string[]>();
  positions.forEach((position, index) => {
    const rows = neighbours[index]?.data?.rows;
    if (rows) variantsByPosition.set(position, rows.map((row) => row.label));
  });

  if (variant.isPending) return <LoadingState label="Loading the variant…" />;
  if (variant.isError) {
    if (variant.error instanceof ApiError && (variant.error.status === 404 || variant.error.status === 400)) {
      return (
        <EmptyState title="There is no such variant.">
          It may have been registered under another id. Find it in the{' '}
          <Link to={paths.registry.href()} className="text-lagoon-700 underline">
            registry
          </Link>
          .
        </EmptyState>
      );
    }
    return <ErrorState error={variant.error} onRetry={() => void variant.refetch()} />;
  }

  const role = me.data?.role ?? 'viewer';
  const data = variant.data;
  const reload = () => void queryClient.invalidateQueries({ queryKey: getVariantQueryOptions(variantId).queryKey });
  const handleStatusChanged = (updated: VariantDto) =>
    void queryClient.invalidateQueries({ queryKey: getCampaignQueryOptions(updated.campaignId).queryKey });

  return (
    <div className="space-y-8">
      <header className="flex flex-wrap items-start justify-between gap-4 border-b border-paper-200 pb-4">
        <div className="space-y-1">
          <p className="text-sm text-ink-600">
            Variant in{' '}
            <Link to={paths.campaign.href(data.campaign.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
              {data.campaign.name}
            </Link>
            {enzyme.data && (
              <>
                {' '}
                on{' '}
                <Link to={paths.enzyme.href(enzyme.data.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
                  {enzyme.data.name}
                </Link>
              </>
            )}
          </p>
          <h1 className="font-mono text-3xl font-semibold tracking-tight text-ink-900">{data.label}</h1>
          <p className="flex flex-wrap items-center gap-3 text-sm">
            <span className="font-mono text-ink-700">{data.hgvs}</span>
            <VariantStatusBadge status={data.status} />
            {data.constructId && <span className="font-mono text-ink-600">{data.constructId}</span>}
          </p>
        </div>
        <div className="flex flex-wrap items-center gap-2">
          <EnergyUnitToggle />
          {can(role, 'measurements:write') && (
            <Link to={paths.assayEntry.href(data.id)} className="rounded-md bg-ember-500 px-3.5 py-2 text-sm font-semibold text-white hover:bg-ember-600">
              Enter an assay
            </Link>
          )}
        </div>
      </header>

      <div className="grid gap-8 lg:grid-cols-[minmax(0,1fr)_21rem]">
        <div className="min-w-0 space-y-8">
          <Section
            id="variant-comparison"
            title={data.isParent ? 'The reference for every comparison' : 'Against the parent'}
            description={
              data.isParent
                ? 'Counted measurements of the parent, by condition group.'
                : "Condition-matched comparison of this variant's counted measurements with the campaign's parent."
            }
          >
            {comparison.isPending && <LoadingState label="Comparing with the parent…" />}
            {comparison.isError && <ErrorState error={comparison.error} onRetry={() => void comparison.refetch()} />}
            {comparison.data && <ComparisonPanel comparison={comparison.data} parentMeasurements={parentMeasurements.data} unit={unit} />}
          </Section>

          <Section id="variant-sequence" title="On the sequence" description="The parent sequence with this variant's substitutions boxed and the annotated catalytic residues marked by role.">
            {enzyme.isPending && <LoadingState label="Loading the parent sequence…" />}
            {enzyme.isError && <ErrorState error={enzyme.error} onRetry={() => void enzyme.refetch()} />}
            {enzyme.data && (
              <SequenceMap sequence={enzyme.data.sequence} sites={enzyme.data.sites} mutations={data.mutations} variantsByPosition={variantsByPosition} />
            )}
          </Section>
        </div>

        <aside className="space-y-4" aria-label="Variant facts">
          <Card title="Mutations">
            <MutationsPanel variant={data} />
          </Card>
          <Card title="Status">
            <StatusPanel variant={data} canEdit={can(role, 'variants:write')} onReload={reload} onChanged={handleStatusChanged} />
          </Card>
          <Card title="Lineage">
            <LineagePanel variant={data} campaignParent={comparison.data?.parentVariant ?? null} />
          </Card>
          <Card title="Construct and notes">
            <DetailsPanel variant={data} canEdit={can(role, 'variants:write')} onReload={reload} />
          </Card>
        </aside>
      </div>

      <Section
        id="variant-measurements"
        title="Assays and measurements"
        description="Every fitted or entered measurement, with its review state, plausibility flags and reporting completeness. Flagged and retracted ones stay here but leave the comparisons."
      >
        {measurements.isPending && <LoadingState label="Loading measurements…" />}
        {measurements.isError && <ErrorState error={measurements.error} onRetry={() => void measurements.refetch()} />}
        {measurements.data && measurements.data.length === 0 && (
          <EmptyState title="No measurements yet.">
            {can(role, 'measurements:write') ? (
              <Link to={paths.assayEntry.href(data.id)} className="text-lagoon-700 underline">
                Enter the first assay
              </Link>
            ) : (
              'A kineticist enters assays for this variant.'
            )}
          </EmptyState>
        )}
        {measurements.data && measurements.data.length > 0 && (
          <MeasurementsTable
            measurements={measurements.data}
            canSubmit={can(role, 'measurements:write')}
            canReview={can(role, 'measurements:review')}
            onReload={() => void measurements.refetch()}
          />
        )}
      </Section>

      <Section id="variant-charts" title="Rate data and charts" description="Plots of the initial rates behind each fit, the pH profile and the comparison with the parent.">
        <VariantCharts variantId={data.id} variantLabel={data.label} />
        <RateDataSummary measurements={measurements.data} variantId={data.id} canEnter={can(role, 'measurements:write')} />
      </Section>

      <div className="grid gap-8 lg:grid-cols-2">
        <Section id="variant-cycles" title="Double-mutant cycles" description="Cycles this variant is a corner of, under matched conditions.">
          {cycles.isPending && <LoadingState label="Looking for cycles…" />}
          {cycles.isError && <ErrorState error={cycles.error} onRetry={() => void cycles.refetch()} />}
          {cycles.data && <CyclesPanel variantId={data.id} cycles={cycles.data} unit={unit} />}
        </Section>
        <Section id="variant-completeness" title="STRENDA completeness" description="Required reporting items (STRENDA Guidelines, Levels 1A and 1B) present in each current measurement.">
          {measurements.isPending && <LoadingState />}
          {measurements.isError && <ErrorState error={measurements.error} onRetry={() => void measurements.refetch()} />}
          {measurements.data && <CompletenessPanel measurements={measurements.data} />}
        </Section>
      </div>
    </div>
  );
}

/** How much rate data stands behind the measurements, with the ways to add more for those who may. */
function RateDataSummary({ measurements, variantId, canEnter }: { measurements: MeasurementDto[] | undefined; variantId: number; canEnter: boolean }) {
  if (!measurements) return null;
  const current = measurements.filter((measurement) => measurement.supersededById === null);
  const fitted = current.filter((measurement) => measurement.source === 'fitted');
  const points = fitted.reduce((sum, measurement) => sum + (measurement.pointCount ?? 0), 0);
  return (
    <div className="flex flex-wrap items-center justify-between gap-3 rounded-lg border border-paper-200 bg-white px-4 py-3 text-sm">
      <p className="text-ink-700">
        {current.length === 0
          ? 'No rate data yet.'
          : `${fitted.length} fitted ${fitted.length === 1 ? 'assay' : 'assays'} (${points} rate points used in the fits), ${current.length - fitted.length} entered as reported values.`}
      </p>
      {canEnter && (
        <span className="flex gap-3">
          <Link to={paths.assayEntry.href(variantId)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
            Enter an assay
          </Link>
          <Link to={paths.phProfileEntry.href(variantId)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
            Enter a pH profile
          </Link>
        </span>
      )}
    </div>
  );
}
