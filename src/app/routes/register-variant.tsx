import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import type { CatalyticSiteDto } from '@shared/schemas/enzyme';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { getCampaignQueryOptions } from '@/features/campaigns/api/get-campaign';
import { useCampaigns } from '@/features/campaigns/api/get-campaigns';
import { useEnzyme } from '@/features/enzymes/api/get-enzyme';
import { RegisterVariantForm } from '@/features/variants/components/register-variant-form';

/** The parent's annotated residues, to write substitutions at them without looking them up. */
function ParentSites({ sites, sequence }: { sites: CatalyticSiteDto[]; sequence: string }) {
  return (
    <aside aria-labelledby="parent-sites-heading" className="rounded-lg border border-paper-200 bg-white p-4 text-sm shadow-card">
      <h2 id="parent-sites-heading" className="font-semibold text-ink-900">
        Annotated residues of the parent
      </h2>
      <p className="mt-1 text-ink-600">{sequence.length} residues; positions count from the first residue.</p>
      {sites.length === 0 ? (
        <p className="mt-2 text-ink-500">None annotated.</p>
      ) : (
        <ul className="mt-2 space-y-1">
          {sites.map((site) => (
            <li key={site.id} className="flex justify-between gap-3">
              <span className="font-mono font-semibold">
                {site.residue}
                {site.position}
              </span>
              <span className="text-ink-700">
                {site.role.charAt(0).toUpperCase() + site.role.slice(1)}
                {site.expectedPka !== null && <span className="text-ink-500"> · pKa {site.expectedPka.toFixed(1)}</span>}
              </span>
            </li>
          ))}
        </ul>
      )}
    </aside>
  );
}

export default function RegisterVariantRoute() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [search, setSearch] = useSearchParams();
  const campaigns = useCampaigns();
  const campaignId = Number(search.get('campaignId')) || undefined;
  const open = campaigns.data?.rows.filter((campaign) => campaign.status !== 'closed') ?? [];
  // With one open campaign the form chooses it; the URL follows so a reload keeps the choice.
  const chosen = open.find((campaign) => campaign.id === campaignId) ?? (open.length === 1 ? open[0] : undefined);
  const enzyme = useEnzyme(chosen?.enzymeId);

  const handleCampaignChange = (id: number | undefined) => {
    const next = new URLSearchParams(search);
    if (id === undefined) next.delete('campaignId');
    else next.set('campaignId', String(id));
    setSearch(next, { replace: true });
  };

  return (
    <div className="max-w-6xl">
      <PageHeader
        title="Register a variant"
        description="Point mutations on a campaign's parent. The text is checked against the parent sequence as you type; the same set on the same parent can be registered once."
      />
      {campaigns.isPending && <LoadingState label="Loading campaigns…" />}
      {campaigns.isError && <ErrorState error={campaigns.error} onRetry={() => void campaigns.refetch()} />}
      {campaigns.data && open.length === 0 && (
        <EmptyState title="There is no open campaign to register variants in.">
          A lead starts a campaign from an{' '}
          <Link to={paths.enzymes.href()} className="text-lagoon-700 underline">
            enzyme
          </Link>
          .
        </EmptyState>
      )}
      {enzyme.isError && <ErrorState error={enzyme.error} onRetry={() => void enzyme.refetch()} />}
      {campaigns.data && open.length > 0 && (
        <div className="grid items-start gap-6 lg:grid-cols-[minmax(0,48rem)_1fr]">
          <RegisterVariantForm
            campaigns={campaigns.data.rows}
            initialCampaignId={chosen?.id}
            parentEnzyme={enzyme.data}
            onCampaignChange={handleCampaignChange}
            onCreated={(variant) => {
              void queryClient.invalidateQueries({ queryKey: getCampaignQueryOptions(variant.campaignId).queryKey });
              navigate(paths.variant.href(variant.id));
            }}
          />
          {enzyme.data && <ParentSites sites={enzyme.data.sites} sequence={enzyme.data.sequence} />}
        </div>
      )}
    </div>
  );
}
