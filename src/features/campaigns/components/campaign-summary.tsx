import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { CampaignDto } from '@shared/schemas/campaign';
import { paths } from '@/config/paths';
import { formatDateTime, formatPh } from '@/lib/format';

const statusMarks: Record<CampaignDto['status'], { icon: string; label: string; className: string }> = {
  active: { icon: '●', label: 'Active', className: 'border-signal-fine bg-signal-fine-soft text-signal-fine' },
  paused: { icon: '❚❚', label: 'Paused', className: 'border-signal-caution bg-signal-caution-soft text-signal-caution' },
  closed: { icon: '■', label: 'Closed', className: 'border-paper-300 bg-paper-100 text-ink-700' },
};

/** A campaign's status as an icon and a word. */
export function CampaignStatusBadge({ status }: { status: CampaignDto['status'] }) {
  const mark = statusMarks[status];
  return (
    <span className={`inline-flex items-center gap-1.5 rounded-full border px-2 py-0.5 text-xs font-semibold ${mark.className}`}>
      <span aria-hidden className="text-[9px]">
        {mark.icon}
      </span>
      {mark.label}
    </span>
  );
}

/** What the campaign is for, on which enzyme, under which target conditions, and who leads it. */
export function CampaignSummary({ campaign }: { campaign: CampaignDto }) {
  return (
    <div className="space-y-4">
      <p className="max-w-3xl whitespace-pre-line text-ink-900">{campaign.objective}</p>
      <dl className="grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
        <Term term="Parent enzyme">
          <Link to={paths.enzyme.href(campaign.enzyme.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
            {campaign.enzyme.name}
          </Link>
        </Term>
        <Term term="Target substrate">{campaign.targetSubstrate}</Term>
        <Term term="Target conditions">
          <span className="font-mono tabular-nums">
            {Number(campaign.targetTemperatureC.toFixed(2))} °C · pH {formatPh(campaign.targetPh)}
          </span>
        </Term>
        <Term term="Lead">{campaign.lead ? campaign.lead.name : <span className="text-ink-500">nobody</span>}</Term>
      </dl>
      <p className="text-xs text-ink-500">
        Settings changed {formatDateTime(campaign.updatedAt)} (version {campaign.version}).
      </p>
    </div>
  );
}

function Term({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="rounded-md border border-paper-200 bg-white px-3 py-2">
      <dt className="text-xs font-medium uppercase tracking-wide text-ink-600">{term}</dt>
      <dd className="mt-0.5 text-sm">{children}</dd>
    </div>
  );
}
