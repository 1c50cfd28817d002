import { Link } from 'react-router-dom';
import type { EnergyUnit } from '@shared/schemas/auth';
import type { CampaignOverviewDto } from '@shared/schemas/overview';
import { variantStatuses, type VariantStatus } from '@shared/schemas/variant';
import { paths } from '@/config/paths';
import { formatDateTime, formatEnergy, formatFoldChange } from '@/lib/format';
import { describeActivity } from '../describe-activity';

// The registry reads the list API's parameter names from its address.
const registryLink = (parameters: Record<string, string>) => paths.registry.href(new URLSearchParams(parameters).toString());

// Statuses a construct passes through on its way to a measurement; failed and archived end the way.
const endStatuses: readonly VariantStatus[] = ['failed', 'archived'];
const pipelineStatuses = variantStatuses.filter((status) => !endStatuses.includes(status));

const capitalised = (word: string) => word.charAt(0).toUpperCase() + word.slice(1);

const campaignStatusStyle = {
  active: 'border-signal-fine text-signal-fine',
  paused: 'border-signal-caution text-signal-caution',
  closed: 'border-ink-400 text-ink-600',
} as const;

const relativeTime = new Intl.RelativeTimeFormat(undefined, { numeric: 'auto' });
const MINUTES_PER_HOUR = 60;
const MINUTES_PER_DAY = 24 * MINUTES_PER_HOUR;
const MINUTES_PER_WEEK = 7 * MINUTES_PER_DAY;

/** "5 minutes ago", "yesterday", "3 days ago"; the date and time once it is more than a week back. */
function ago(iso: string, now: number): string {
  const minutes = (new Date(iso).getTime() - now) / 60_000;
  const elapsed = Math.abs(minutes);
  if (elapsed < MINUTES_PER_HOUR) return relativeTime.format(Math.round(minutes), 'minute');
  if (elapsed < MINUTES_PER_DAY) return relativeTime.format(Math.round(minutes / MINUTES_PER_HOUR), 'hour');
  if (elapsed < MINUTES_PER_WEEK) return relativeTime.format(Math.round(minutes / MINUTES_PER_DAY), 'day');
  return formatDateTime(iso);
}

function StatusCount({ campaignId, status, count }: { campaignId: number; status: VariantStatus; count: number }) {
  return (
    <li>
      <Link
        to={registryLink({ campaignId: String(campaignId), status })}
        className={`flex min-w-24 flex-col rounded-md border px-3 py-2 hover:border-lagoon-500 hover:bg-lagoon-50 ${count === 0 ? 'border-paper-200 text-ink-500' : 'border-paper-300 text-ink-900'}`}
        aria-label={`${count} ${status}: show them in the registry`}
      >
        <span className="numeric text-left font-mono text-xl font-semibold">{count}</span>
        <span className="text-xs">{capitalised(status)}</span>
      </Link>
    </li>
  );
}

export interface CampaignOverviewCardProps {
  overview: CampaignOverviewDto;
  energyUnit: EnergyUnit;
  /** Whether the reader may approve and flag (leads and admins): they get the way to the Review page. */
  mayReview: boolean;
  /** When the data was fetched, for "5 minutes ago". */
  now: number;
}

export function CampaignOverviewCard({ overview, energyUnit, mayReview, now }: CampaignOverviewCardProps) {
  const { campaign, bestVariants, awaitingReview, recentActivity } = overview;
  const headingId = `campaign-${campaign.id}-heading`;

  return (
    <section aria-labelledby={headingId} className="rounded-lg border border-paper-200 bg-white shadow-card">
      <header className="flex flex-wrap items-start justify-between gap-3 border-b border-paper-200 px-5 py-4">
        <div>
          <h2 id={headingId} className="text-lg font-semibold text-ink-900">
            <Link to={paths.campaign.href(campaign.id)} className="hover:text-lagoon-700 hover:underline">
              {campaign.name}
            </Link>
          </h2>
          <p className="mt-0.5 text-sm text-ink-600">
            {campaign.enzyme.name} · {campaign.targetSubstrate} at pH {campaign.targetPh}, {campaign.targetTemperatureC} °C
            {campaign.lead && <> · led by {campaign.lead.name}</>}
          </p>
        </div>
        <span className={`rounded-full border px-2.5 py-0.5 text-xs font-semibold ${campaignStatusStyle[campaign.status]}`}>
          {capitalised(campaign.status)}
        </span>
      </header>

      <div className="space-y-2 border-b border-paper-200 px-5 py-4">
        <h3 className="text-sm font-semibold text-ink-700">
          Variants by status <span className="font-normal text-ink-500">({campaign.variantTotal} in all, the parent included)</span>
        </h3>
        <div className="flex flex-wrap items-stretch gap-4">
          <ol aria-label="On the way to a measurement" className="flex flex-wrap gap-2">
            {pipelineStatuses.map((status) => (
              <StatusCount key={status} campaignId={campaign.id} status={status} count={campaign.variantCounts[status]} />
            ))}
          </ol>
          <ul aria-label="Stopped" className="flex flex-wrap gap-2 border-l border-paper-200 pl-4">
            {endStatuses.map((status) => (
              <StatusCount key={status} campaignId={campaign.id} status={status} count={campaign.variantCounts[status]} />
            ))}
          </ul>
        </div>
      </div>

      <div className="grid gap-0 lg:grid-cols-[3fr_2fr]">
        <div className="border-b border-paper-200 px-5 py-4 lg:border-r lg:border-b-0">
          <div className="mb-2 flex items-baseline justify-between gap-3">
            <h3 className="text-sm font-semibold text-ink-700">Best variants against the matched parent</h3>
            <Link to={registryLink({ campaignId: String(campaign.id), sort: 'ddg', order: 'asc' })} className="text-sm font-semibold text-lagoon-700 hover:underline">
              All, ranked, in the registry →
            </Link>
          </div>
          {bestVariants.length === 0 ? (
            <p className="rounded-md border border-dashed border-paper-300 px-4 py-6 text-center text-sm text-ink-500">
              No variant has a ΔΔG‡ yet: it needs a measurement and a parent measured under matched conditions.
            </p>
          ) : (
            <table className="w-full text-sm">
              <caption className="sr-only">Best variants of {campaign.name}, most negative ΔΔG‡ first</caption>
              <thead className="text-left text-xs text-ink-600">
                <tr className="border-b border-paper-200">
                  <th scope="col" className="py-1.5 pr-3 font-semibold">#</th>
                  <th scope="col" className="py-1.5 pr-3 font-semibold">Variant</th>
                  <th scope="col" className="numeric py-1.5 pr-3 font-semibold">ΔΔG‡ ± SE ({energyUnit})</th>
                  <th scope="col" className="numeric py-1.5 pr-3 font-semibold">Fold change (kcat/Km)</th>
                  <th scope="col" className="numeric py-1.5 font-semibold">n</th>
                </tr>
              </thead>
              <tbody className="divide-y divide-paper-200">
                {bestVariants.map((variant, index) => (
                  <tr key={variant.id}>
                    <td className="numeric py-1.5 pr-3 text-left font-mono text-ink-500">{index + 1}</td>
                    <td className="py-1.5 pr-3">
                      <Link to={paths.variant.href(variant.id)} className="font-mono font-semibold text-lagoon-700 hover:underline">
                        {variant.label}
                      </Link>
                    </td>
                    <td className="numeric py-1.5 pr-3 font-mono">
                      {formatEnergy(variant.ddg?.value, variant.ddg?.se, energyUnit).replace(` ${energyUnit}`, '')}
                    </td>
                    <td className="numeric py-1.5 pr-3 font-mono">{formatFoldChange(variant.foldChange)}</td>
                    <td className="numeric py-1.5 font-mono">{variant.measurementCount}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          )}
        </div>

        <div className="divide-y divide-paper-200">
          <div className="px-5 py-4">
            <h3 className="text-sm font-semibold text-ink-700">Waiting for review</h3>
            <p className="mt-1 flex flex-wrap items-baseline gap-x-3 gap-y-1 text-sm">
              <span>
                <span className="font-mono text-xl font-semibold text-ink-900">{awaitingReview}</span>{' '}
                submitted {awaitingReview === 1 ? 'measurement' : 'measurements'}
              </span>
              {awaitingReview > 0 && mayReview && (
                <Link to={paths.review.href()} className="font-semibold text-lagoon-700 hover:underline">
                  Review them →
                </Link>
              )}
              {awaitingReview > 0 && !mayReview && <span className="text-ink-500">A lead approves or flags them.</span>}
            </p>
          </div>
          <div className="px-5 py-4">
            <h3 className="mb-2 text-sm font-semibold text-ink-700">Recent activity</h3>
            {recentActivity.length === 0 ? (
              <p className="text-sm text-ink-500">Nothing has happened in this campaign yet.</p>
            ) : (
              <ol className="space-y-2 text-sm">
                {recentActivity.map((event) => {
                  const sentence = describeActivity(event);
                  return (
                    <li key={event.id} className="flex gap-3">
                      <time dateTime={event.at} title={formatDateTime(event.at)} className="w-24 shrink-0 text-xs leading-5 text-ink-500">
                        {ago(event.at, now)}
                      </time>
                      <span className="text-ink-700">
                        <span className="font-medium text-ink-900">{sentence.actor}</span> {sentence.lead}{' '}
                        {sentence.variant && (
                          <Link to={paths.variant.href(sentence.variant.id)} className="font-mono font-semibold text-lagoon-700 hover:underline">
                            {sentence.variant.label}
                          </Link>
                        )}
                        {sentence.tail}
                      </span>
                    </li>
                  );
                })}
              </ol>
            )}
          </div>
        </div>
      </div>
    </section>
  );
}
