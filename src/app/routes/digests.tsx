import { useSearchParams } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import type { DigestCampaignDto, DigestScheduleDto } from '@shared/schemas/digest';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Tabs } from '@/components/ui/tabs';
import { useMe } from '@/features/auth/api/get-me';
import { useDigestCampaigns } from '@/features/digests/api/get-digest-campaigns';
import { useSendDigest } from '@/features/digests/api/send-digest';
import { DigestPreviewPanel } from '@/features/digests/components/digest-preview-panel';
import { DigestRunDetail } from '@/features/digests/components/digest-run-detail';
import { DigestRunsTable } from '@/features/digests/components/digest-runs-table';
import { DigestSettingsForm } from '@/features/digests/components/digest-settings-form';
import { SubscribersList } from '@/features/digests/components/subscribers-list';
import { SubscriptionToggle } from '@/features/digests/components/subscription-toggle';
import { ApiError } from '@/lib/api-client';
import { formatDateTime } from '@/lib/format';

type Tab = 'preview' | 'runs';

function scheduleText(schedule: DigestScheduleDto): string {
  const day = `${schedule.day[0].toUpperCase()}${schedule.day.slice(1)}`;
  return `${day}s at ${String(schedule.hour).padStart(2, '0')}:00 (${schedule.timezone})`;
}

export default function DigestsRoute() {
  const me = useMe();
  const campaigns = useDigestCampaigns();
  const [search, setSearch] = useSearchParams();
  const change = (changes: Record<string, string | null>) => {
    const next = new URLSearchParams(search);
    for (const [key, value] of Object.entries(changes)) {
      if (value === null) next.delete(key);
      else next.set(key, value);
    }
    setSearch(next, { replace: true });
  };

  const list = campaigns.data?.campaigns ?? [];
  const selectedId = Number(search.get('campaign')) || list[0]?.campaign.id || null;
  const selected = list.find((entry) => entry.campaign.id === selectedId) ?? null;
  const tab: Tab = search.get('tab') === 'runs' ? 'runs' : 'preview';
  const manages = me.data ? can(me.data.role, 'digests:manage') : false;

  return (
    <div>
      <PageHeader
        title="Digests"
        description={
          campaigns.data
            ? `The weekly ranking of each campaign goes out on ${scheduleText(campaigns.data.schedule)}${campaigns.data.schedule.nextRunAt ? `; next on ${formatDateTime(campaigns.data.schedule.nextRunAt)}` : ''}. Each campaign's lead gets it by default; anyone may subscribe.`
            : undefined
        }
      />
      {campaigns.isPending && <LoadingState label="Loading digests…" />}
      {campaigns.isError && <ErrorState error={campaigns.error} onRetry={() => void campaigns.refetch()} />}
      {campaigns.data && list.length === 0 && (
        <EmptyState title="No campaigns yet.">A campaign’s weekly digest appears here once the campaign exists.</EmptyState>
      )}
      {selected && (
        <div className="grid gap-6 lg:grid-cols-[16rem_1fr]">
          <nav aria-label="Campaigns">
            <ul className="space-y-1">
              {list.map((entry) => (
                <li key={entry.campaign.id}>
                  <button
                    type="button"
                    aria-current={entry.campaign.id === selected.campaign.id ? 'true' : undefined}
                    onClick={() => change({ campaign: String(entry.campaign.id), run: null, page: null })}
                    className={`w-full rounded-md px-3 py-2 text-left text-sm ${entry.campaign.id === selected.campaign.id ? 'bg-lagoon-50 font-semibold text-lagoon-900' : 'text-ink-700 hover:bg-paper-100'}`}
                  >
                    <span className="block">{entry.campaign.name}</span>
                    <span className="block text-xs font-normal text-ink-500">
                      {entry.subscription.subscribed ? '✓ subscribed' : 'not subscribed'} · {entry.subscriberCount} recipient{entry.subscriberCount === 1 ? '' : 's'}
                    </span>
                  </button>
                </li>
              ))}
            </ul>
          </nav>
          <CampaignDigest
            entry={selected}
            manages={manages}
            tab={tab}
            runId={Number(search.get('run')) || null}
            page={Math.max(1, Number(search.get('page')) || 1)}
            onChange={change}
          />
        </div>
      )}
    </div>
  );
}

function CampaignDigest({
  entry,
  manages,
  tab,
  runId,
  page,
  onChange,
}: {
  entry: DigestCampaignDto;
  manages: boolean;
  tab: Tab;
  runId: number | null;
  page: number;
  onChange: (changes: Record<string, string | null>) => void;
}) {
  const send = useSendDigest();
  const failure = send.error instanceof ApiError ? send.error : null;
  const handleSend = () =>
    send.mutate(entry.campaign.id, {
      onSuccess: (run) => onChange({ tab: 'runs', run: String(run.id), page: null }),
    });

  return (
    <div className="space-y-6">
      <section aria-label="Subscription and settings" className="grid gap-4 rounded-lg border border-paper-200 bg-white p-5 shadow-card xl:grid-cols-2">
        <div className="space-y-4">
          <div>
            <h2 className="text-lg font-semibold">{entry.campaign.name}</h2>
            <p className="text-sm text-ink-500">
              Lead: {entry.campaign.lead?.name ?? 'none'} · {entry.campaign.status}
              {entry.lastRun ? ` · last digest ${formatDateTime(entry.lastRun.scheduledFor)}` : ' · no digest yet'}
            </p>
          </div>
          <SubscriptionToggle entry={entry} />
          {manages && (
            <div className="space-y-2">
              <h3 className="text-sm font-semibold text-ink-700">Recipients ({entry.subscriberCount})</h3>
              <SubscribersList campaignId={entry.campaign.id} />
              <div className="flex flex-wrap items-center gap-3 pt-1">
                <Button variant="primary" busy={send.isPending} onClick={handleSend} disabled={entry.subscriberCount === 0}>
                  Send now
                </Button>
                <span className="text-xs text-ink-500">Sends this campaign’s digest to its recipients at once; the weekly one still goes out.</span>
              </div>
              {failure && <Notice tone="danger" title="The digest was not sent">{failure.message}</Notice>}
              {send.isSuccess && <Notice tone="fine" title={`Digest queued for ${send.data.recipientCount} ${send.data.recipientCount === 1 ? 'person' : 'people'}.`} />}
            </div>
          )}
        </div>
        {manages ? (
          <div className="space-y-2 xl:border-l xl:border-paper-200 xl:pl-5">
            <h3 className="text-sm font-semibold text-ink-700">Settings</h3>
            <DigestSettingsForm settings={entry.settings} />
          </div>
        ) : (
          <p className="text-sm text-ink-600 xl:border-l xl:border-paper-200 xl:pl-5">
            Ranks on {entry.settings.reviewStates.join(' and ')} measurements, top {entry.settings.topCount}. The campaign lead chooses.
          </p>
        )}
      </section>

      <section aria-label="Digest content" className="space-y-4">
        <Tabs
          label="Digest views"
          tabs={[
            { id: 'preview', label: 'Next digest (preview)' },
            { id: 'runs', label: 'Past digests' },
          ]}
          selected={tab}
          onSelect={(id) => onChange({ tab: id, run: null, page: null })}
        />
        {tab === 'preview' && <DigestPreviewPanel campaignId={entry.campaign.id} />}
        {tab === 'runs' &&
          (runId !== null ? (
            <DigestRunDetail runId={runId} onClose={() => onChange({ run: null })} />
          ) : (
            <DigestRunsTable campaignId={entry.campaign.id} page={page} onPage={(next) => onChange({ page: String(next) })} onOpen={(id) => onChange({ run: String(id) })} />
          ))}
      </section>
    </div>
  );
}
