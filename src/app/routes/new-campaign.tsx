import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useLeadCandidates } from '@/features/campaigns/api/get-lead-candidates';
import { CreateCampaignForm } from '@/features/campaigns/components/campaign-form';
import { getEnzymeQueryOptions } from '@/features/enzymes/api/get-enzyme';
import { useEnzymes } from '@/features/enzymes/api/get-enzymes';

export default function NewCampaignRoute() {
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const [search] = useSearchParams();
  const me = useMe();
  const enzymes = useEnzymes();
  const leads = useLeadCandidates(true);
  const initialEnzymeId = Number(search.get('enzymeId')) || undefined;

  return (
    <div className="max-w-3xl">
      <PageHeader
        title="New campaign"
        description="A campaign works on one parent enzyme toward a target substrate and conditions; every variant is compared with the parent there."
      />
      {(enzymes.isPending || leads.isPending) && <LoadingState label="Loading enzymes and leads…" />}
      {enzymes.isError && <ErrorState error={enzymes.error} onRetry={() => void enzymes.refetch()} />}
      {leads.isError && <ErrorState error={leads.error} onRetry={() => void leads.refetch()} />}
      {enzymes.data && enzymes.data.rows.length === 0 && (
        <EmptyState title="There is no enzyme to start from.">
          <Link to={paths.newEnzyme.href()} className="text-lagoon-700 underline">
            Add the parent enzyme first
          </Link>
          .
        </EmptyState>
      )}
      {enzymes.data && enzymes.data.rows.length > 0 && leads.data && me.data && (
        <CreateCampaignForm
          enzymes={enzymes.data.rows}
          leads={leads.data}
          meId={me.data.id}
          initialEnzymeId={initialEnzymeId}
          onCreated={(campaign) => {
            // The enzyme's page lists its campaigns.
            void queryClient.invalidateQueries({ queryKey: getEnzymeQueryOptions(campaign.enzymeId).queryKey });
            navigate(paths.campaign.href(campaign.id));
          }}
        />
      )}
    </div>
  );
}
