import { useEffect, useMemo, useState, type ReactNode } from 'react';
import { useNavigate, useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useEnergyUnit } from '@/features/auth/api/update-preferences';
import { EnergyUnitToggle } from '@/features/auth/components/energy-unit-toggle';
import { AdditivityChart } from '@/features/charts/components/additivity-chart';
import { HeatMapChart } from '@/features/charts/components/heat-map-chart';
import { KcatKmScatterChart } from '@/features/charts/components/kcat-km-scatter-chart';
import { PhOptimumShiftChart } from '@/features/charts/components/ph-optimum-shift-chart';
import { useCampaignCycles } from '@/features/landscape/api/get-campaign-cycles';
import { useCampaignLandscape } from '@/features/landscape/api/get-campaign-landscape';
import { useCampaigns } from '@/features/landscape/api/get-campaigns';
import { maxLandscapeVariants, useLandscapeVariants } from '@/features/landscape/api/get-landscape-variants';
import { useVariant } from '@/features/landscape/api/get-variant';
import { CouplingTable } from '@/features/landscape/components/coupling-table';
import { LandscapeFilterBar } from '@/features/landscape/components/landscape-filter-bar';
import { filterCells, hasVariantFilters, readLandscapeFilters } from '@/features/landscape/lib/landscape-filters';

function Section({ id, title, description, actions, children }: { id: string; title: string; description?: string; actions?: ReactNode; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="space-y-3">
      <div className="flex flex-wrap items-end justify-between gap-2">
        <div>
          <h2 id={id} className="text-lg font-semibold">
            {title}
          </h2>
          {description && <p className="max-w-3xl text-sm text-ink-500">{description}</p>}
        </div>
        {actions}
      </div>
      {children}
    </section>
  );
}

export default function LandscapeRoute() {
  const [params, setParams] = useSearchParams();
  const navigate = useNavigate();
  const { filters, problems } = useMemo(() => readLandscapeFilters(params), [params]);
  const campaignId = filters.campaignId;
  const campaigns = useCampaigns();
  const campaign = campaigns.data?.rows.find((row) => row.id === campaignId);
  const landscape = useCampaignLandscape(campaignId);
  const filtersKey = params.toString();
  // The variant list for the scatter plots (up to ten pages) and the cycles wait until the map is drawn,
  // so their computing, downloads and parsing do not compete with the first chart a lead looks at.
  const [mapDrawnFor, setMapDrawnFor] = useState<string | null>(null);
  const cells = useMemo(() => (landscape.data ? filterCells(landscape.data, filters) : []), [landscape.data, filters]);
  const mapSettled = mapDrawnFor === filtersKey || landscape.isError || (landscape.data !== undefined && cells.length === 0);
  const variants = useLandscapeVariants(filters, mapSettled);
  const cycles = useCampaignCycles(campaignId, mapSettled);
  const parent = useVariant(campaign?.parentVariantId ?? null);
  const [energyUnit] = useEnergyUnit();

  // Without a campaign in the URL, show the first one and say so in the URL, so the view can be shared.
  useEffect(() => {
    const first = campaigns.data?.rows[0];
    if (campaignId === undefined && first) {
      const next = new URLSearchParams(params);
      next.set('campaignId', String(first.id));
      setParams(next, { replace: true });
    }
  }, [campaignId, campaigns.data, params, setParams]);

  const openVariant = (variantId: number) => navigate(paths.variant.href(variantId));
  const filtered = hasVariantFilters(filters);
  const filteredIds = useMemo(() => new Set(variants.data?.rows.map((row) => row.id) ?? []), [variants.data]);
  const visibleCycles = useMemo(() => {
    if (!cycles.data) return [];
    // With filters on, the plot keeps the combinations the filters keep (when the list was fetched in full).
    return filtered && variants.data && !variants.data.truncated ? cycles.data.cycles.filter((cycle) => filteredIds.has(cycle.combination.id)) : cycles.data.cycles;
  }, [cycles.data, filtered, variants.data, filteredIds]);

  if (campaigns.isPending) return <LoadingState label="Loading campaigns…" />;
  if (campaigns.isError) return <ErrorState error={campaigns.error} onRetry={() => void campaigns.refetch()} />;
  if (campaigns.data.rows.length === 0) {
    return (
      <div>
        <PageHeader title="Landscape" />
        <EmptyState title="There are no campaigns yet.">A landscape shows the variants of one campaign; create a campaign first.</EmptyState>
      </div>
    );
  }

  const campaignName = campaign?.name ?? 'Campaign';
  const parentOptimum = parent.data?.phOptimum ?? null;
  const measuredVariants = variants.data?.rows.filter((row) => row.kcat !== null && row.km !== null) ?? [];
  const withOptimum = variants.data?.rows.filter((row) => !row.isParent && row.phOptimum !== null) ?? [];

  return (
    <div className="space-y-8">
      <PageHeader
        title="Landscape"
        description="The shape of a campaign: every single substitution's effect on kcat/Km, the kinetics of each variant, how far pH optima moved, and whether combinations add up. Click a cell or a point to open the variant."
      />
      <LandscapeFilterBar filters={filters} problems={problems} onChange={(search) => setParams(new URLSearchParams(search))} />
      {campaignId !== undefined && !campaign && <ErrorState error={new Error(`There is no campaign ${campaignId}.`)} />}

      <Section
        id="heat-map-title"
        title="Single substitutions"
        description="Position along, substituted residue down; colour is log₁₀ of the fold change in kcat/Km over the parent measured under matched conditions (0 = like the parent). Grey cells are registered variants without a matched comparison; the dot marks the parent residue; the strip above marks annotated catalytic positions."
      >
        {landscape.isPending && <LoadingState label="Loading the landscape…" />}
        {landscape.isError && <ErrorState error={landscape.error} onRetry={() => void landscape.refetch()} />}
        {landscape.data && landscape.data.cells.length === 0 && (
          <EmptyState title="No single-substitution variants in this campaign yet.">The map fills in as single substitutions are registered and measured against the parent.</EmptyState>
        )}
        {landscape.data && landscape.data.cells.length > 0 && cells.length === 0 && <EmptyState title="No single substitution passes these filters.">Clear a filter to see the map.</EmptyState>}
        {landscape.data && cells.length > 0 && (
          <>
            <HeatMapChart
              landscape={landscape.data}
              cells={cells}
              campaignName={campaignName}
              parentVariantId={campaign?.parentVariantId ?? null}
              onOpenVariant={openVariant}
              onDrawn={() => setMapDrawnFor(filtersKey)}
            />
            <p className="text-sm text-ink-500">
              {cells.length} of {landscape.data.counts.singleVariants} single substitutions shown{filtered ? ' (filtered)' : ''}; {cells.filter((cell) => cell.log10FoldChange !== null).length} compared with the parent; {landscape.data.counts.catalyticPositions} catalytic positions annotated.
            </p>
          </>
        )}
      </Section>

      <div className="grid gap-8 xl:grid-cols-2">
        <Section id="scatter-title" title="kcat and Km" description="Each variant's summary kinetics on log axes; along a dashed line kcat/Km is constant, and the shaded corner is the diffusion limit.">
          {variants.isPending && <LoadingState label="Loading the variants…" />}
          {variants.isError && <ErrorState error={variants.error} onRetry={() => void variants.refetch()} />}
          {variants.data && measuredVariants.length === 0 && <EmptyState title="No variant has kcat and Km yet.">Fitted assays against the parent fill this plot.</EmptyState>}
          {variants.data && measuredVariants.length > 0 && (
            <KcatKmScatterChart
              variants={measuredVariants}
              campaignName={campaignName}
              note={variants.data.truncated ? `the ${maxLandscapeVariants.toLocaleString('en-US')} highest kcat/Km of ${variants.data.total.toLocaleString('en-US')}` : undefined}
              onOpenVariant={openVariant}
            />
          )}
        </Section>

        <Section id="ph-shift-title" title="pH optimum" description="How far each variant's pH optimum moved from the parent's, with the shift the campaign's target pH asks for.">
          {(variants.isPending || parent.isPending) && <LoadingState label="Loading pH optima…" />}
          {variants.isError && <ErrorState error={variants.error} onRetry={() => void variants.refetch()} />}
          {parent.isError && <ErrorState error={parent.error} onRetry={() => void parent.refetch()} />}
          {variants.data && parent.data && parentOptimum === null && <EmptyState title="The parent has no pH profile yet.">Shifts are measured from the parent's optimum; enter its pH profile first.</EmptyState>}
          {variants.data && parentOptimum !== null && withOptimum.length === 0 && <EmptyState title="No variant has a pH profile yet.">pH profiles with a bell-shaped fit give each variant an optimum.</EmptyState>}
          {variants.data && parentOptimum !== null && withOptimum.length > 0 && (
            <PhOptimumShiftChart variants={withOptimum} parentPhOptimum={parentOptimum} targetPh={campaign?.targetPh ?? null} campaignName={campaignName} onOpenVariant={openVariant} />
          )}
        </Section>
      </div>

      <Section
        id="additivity-title"
        title="Additivity"
        description="Each combination's ΔΔG‡ (from kcat/Km) against the sum of its singles'. On the dashed line the mutations act independently; the distance from it is the coupling energy of the double-mutant cycle."
        actions={<EnergyUnitToggle />}
      >
        {cycles.isPending && <LoadingState label="Loading double-mutant cycles…" />}
        {cycles.isError && <ErrorState error={cycles.error} onRetry={() => void cycles.refetch()} />}
        {cycles.data && visibleCycles.filter((cycle) => cycle.kcatOverKm !== null).length === 0 && (
          <EmptyState title="No complete double-mutant cycle yet.">A cycle needs the combination, both singles and the parent measured under matched conditions.</EmptyState>
        )}
        {cycles.data && visibleCycles.some((cycle) => cycle.kcatOverKm !== null) && (
          <div className="grid gap-4 xl:grid-cols-[3fr_2fr]">
            <AdditivityChart cycles={visibleCycles} unit={energyUnit} campaignName={campaignName} onOpenVariant={openVariant} />
            <CouplingTable cycles={{ ...cycles.data, cycles: visibleCycles }} unit={energyUnit} />
          </div>
        )}
      </Section>
    </div>
  );
}
