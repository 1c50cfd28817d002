import { useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useCampaign } from '@/features/campaigns/api/get-campaign';
import { useCampaignActivity } from '@/features/campaigns/api/get-campaign-activity';
import { useLeadCandidates } from '@/features/campaigns/api/get-lead-candidates';
import { EditCampaignForm } from '@/features/campaigns/components/campaign-form';
import { CampaignStatusBadge, CampaignSummary } from '@/features/campaigns/components/campaign-summary';
import { MembersActivity } from '@/features/campaigns/components/members-activity';
import { StatusCounts } from '@/features/campaigns/components/status-counts';
import { useVariants } from '@/features/variants/api/get-variants';

// The most recently changed variants name the ones the activity feed refers to.
const labelledVariants = 500;

function Section({ id, title, actions, children }: { id: string; title: string; actions?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="space-y-3 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`${id}-heading`} className="text-lg font-semibold text-ink-900">
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

export default function CampaignRoute() {
  const campaignId = Number(useParams().id);
  const me = useMe();
  const role = me.data?.role ?? 'viewer';
  const canManage = can(role, 'campaigns:manage');
  const campaign = useCampaign(campaignId);
  const activity = useCampaignActivity(campaignId);
  const variants = useVariants({ campaignId, sort: 'updated', pageSize: labelledVariants }, Number.isInteger(campaignId) && campaignId > 0);
  const leads = useLeadCandidates(canManage);
  const [editing, setEditing] = useState(false);

  if (campaign.isPending) return <LoadingState label="Loading the campaign…" />;
  if (campaign.isError) {
    if (campaign.error instanceof ApiError && (campaign.error.status === 404 || campaign.error.status === 400)) {
      return (
        <EmptyState title="There is no such campaign.">
          Campaigns are listed on the{' '}
          <Link to={paths.home.href()} className="text-lagoon-700 underline">
            overview
          </Link>
          .
        </EmptyState>
      );
    }
    return <ErrorState error={campaign.error} onRetry={() => void campaign.refetch()} />;
  }

  const data = campaign.data;
  const variantLabels = new Map((variants.data?.rows ?? []).map((row) => [row.id, row.label]));

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4 border-b border-paper-200 pb-4">
        <div>
          <p className="text-sm text-ink-600">Campaign</p>
          <h1 className="flex flex-wrap items-center gap-3 text-2xl font-semibold tracking-tight text-ink-900">
            {data.name} <CampaignStatusBadge status={data.status} />
          </h1>
        </div>
        <div className="flex flex-wrap gap-2">
          <Link to={paths.registry.href(new URLSearchParams({ campaignId: String(data.id) }).toString())} className="rounded-md border border-paper-300 bg-white px-3.5 py-2 text-sm font-semibold text-ink-900 hover:bg-paper-100">
            Its variants in the registry
          </Link>
          {can(role, 'variants:write') && data.status !== 'closed' && (
            <Link to={paths.registerVariant.href(data.id)} className="rounded-md bg-ember-500 px-3.5 py-2 text-sm font-semibold text-white hover:bg-ember-600">
              Register a variant
            </Link>
          )}
        </div>
      </header>

      <Section
        id="campaign-settings"
        title={editing ? 'Edit the campaign' : 'Objective and targets'}
        actions={
          canManage &&
          !editing && (
            <Button className="px-2.5 py-1" onClick={() => setEditing(true)}>
              Edit settings
            </Button>
          )
        }
      >
        {editing ? (
          leads.isPending ? (
            <LoadingState label="Loading who may lead…" />
          ) : leads.isError ? (
            <ErrorState error={leads.error} onRetry={() => void leads.refetch()} />
          ) : (
            <EditCampaignForm campaign={data} leads={leads.data} onDone={() => setEditing(false)} onReload={() => void campaign.refetch()} />
          )
        ) : (
          <CampaignSummary campaign={data} />
        )}
      </Section>

      <div className="grid gap-6 lg:grid-cols-[22rem_minmax(0,1fr)]">
        <Section id="campaign-counts" title="Variants by status">
          <StatusCounts campaign={data} />
        </Section>
        <Section id="campaign-activity" title="Members' activity">
          {activity.isPending && <LoadingState label="Loading the activity…" />}
          {activity.isError && <ErrorState error={activity.error} onRetry={() => void activity.refetch()} />}
          {activity.data && <MembersActivity activity={activity.data} variantLabels={variantLabels} />}
        </Section>
      </div>
    </div>
  );
}
