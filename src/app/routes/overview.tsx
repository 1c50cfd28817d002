import { Link } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useEnergyUnit } from '@/features/auth/api/update-preferences';
import { EnergyUnitToggle } from '@/features/auth/components/energy-unit-toggle';
import { useOverview } from '@/features/overview/api/get-overview';
import { CampaignOverviewCard } from '@/features/overview/components/campaign-overview-card';

export default function OverviewRoute() {
  const me = useMe();
  const overview = useOverview();
  const [energyUnit] = useEnergyUnit();
  const role = me.data?.role;

  return (
    <div>
      <PageHeader
        title="Overview"
        description="Where each campaign stands: its variants by status, the best of them against the parent measured under matched conditions, the measurements waiting for review and what changed last."
        actions={<EnergyUnitToggle />}
      />
      {overview.isPending && <LoadingState label="Loading the campaigns…" />}
      {overview.isError && <ErrorState error={overview.error} onRetry={() => void overview.refetch()} />}
      {overview.data && overview.data.campaigns.length === 0 && (
        <EmptyState title="No campaigns yet.">
          {role && can(role, 'campaigns:manage') ? (
            <p>
              Start one from a parent enzyme:{' '}
              <Link to={paths.enzymes.href()} className="font-semibold text-lagoon-700 hover:underline">
                go to the enzymes
              </Link>
              .
            </p>
          ) : (
            <p>A lead starts a campaign from a parent enzyme; it will show here.</p>
          )}
        </EmptyState>
      )}
      {overview.data && overview.data.campaigns.length > 0 && (
        <div className="space-y-6">
          {overview.data.campaigns.map((entry) => (
            <CampaignOverviewCard
              key={entry.campaign.id}
              overview={entry}
              energyUnit={energyUnit}
              mayReview={role ? can(role, 'measurements:review') : false}
              now={overview.dataUpdatedAt}
            />
          ))}
        </div>
      )}
    </div>
  );
}
