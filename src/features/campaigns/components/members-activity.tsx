import { Link } from 'react-router-dom';
import type { AuditEventDto, AuditListDto } from '@shared/schemas/audit';
import { EmptyState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { formatDateTime } from '@/lib/format';

interface Snapshot {
  label?: string;
  variantId?: number;
  status?: string;
  source?: string;
  reviewReason?: string | null;
}

type Kind = 'variants' | 'data' | 'reviews' | 'settings';

const reviewVerbs: Record<string, string> = { submit: 'submitted', approve: 'approved', flag: 'flagged', retract: 'retracted' };

interface Described {
  kind: Kind;
  text: string;
  variantId?: number;
  reason?: string;
}

const snapshot = (value: unknown): Snapshot => (value && typeof value === 'object' ? (value as Snapshot) : {});

/** One audit event in words, and whether it is variant work, data entry, review or settings. */
function describe(event: AuditEventDto, labelOf: (variantId: number) => string): Described {
  const before = snapshot(event.before);
  const after = snapshot(event.after);
  if (event.entityType === 'variant') {
    const label = after.label ?? before.label ?? `variant ${event.entityId}`;
    if (event.action === 'create') return { kind: 'variants', text: `registered ${label}`, variantId: event.entityId };
    if (event.action === 'status') return { kind: 'variants', text: `moved ${label} from ${before.status} to ${after.status}`, variantId: event.entityId };
    return { kind: 'variants', text: `edited ${label}`, variantId: event.entityId };
  }
  const variantId = after.variantId ?? before.variantId;
  const of = variantId === undefined ? '' : ` of ${labelOf(variantId)}`;
  if (event.entityType === 'assay') {
    return { kind: 'data', text: event.action === 'refit' ? `refitted assay ${event.entityId}${of}` : `entered assay ${event.entityId}${of}`, variantId };
  }
  if (event.entityType === 'measurement') {
    if (event.action in reviewVerbs) {
      return { kind: 'reviews', text: `${reviewVerbs[event.action]} measurement ${event.entityId}${of}`, variantId, reason: after.reviewReason ?? undefined };
    }
    if (event.action === 'create') {
      return { kind: 'data', text: `${after.source === 'entered' ? 'entered' : 'fitted'} measurement ${event.entityId}${of}`, variantId };
    }
    return { kind: 'data', text: `${event.action === 'supersede' ? 'superseded' : event.action} measurement ${event.entityId}${of}`, variantId };
  }
  if (event.entityType === 'ph-profile') return { kind: 'data', text: `added a pH profile${of}`, variantId };
  if (event.entityType === 'campaign') {
    return { kind: 'settings', text: event.action === 'create' ? 'created the campaign' : 'changed the campaign settings' };
  }
  return { kind: 'settings', text: `${event.action} ${event.entityType} ${event.entityId}` };
}

interface MembersActivityProps {
  activity: AuditListDto;
  /** Labels of the campaign's variants known to the page, to name them in the feed. */
  variantLabels: ReadonlyMap<number, string>;
  /** How many events the feed lists under the summary. */
  recentCount?: number;
}

/** Who has been doing what in the campaign, from the audit trail: a summary per person and the latest changes. */
export function MembersActivity({ activity, variantLabels, recentCount = 15 }: MembersActivityProps) {
  if (activity.rows.length === 0) return <EmptyState title="No activity recorded yet." />;

  const labels = new Map(variantLabels);
  for (const event of activity.rows) {
    const label = snapshot(event.after).label;
    if (event.entityType === 'variant' && label) labels.set(event.entityId, label);
  }
  const labelOf = (variantId: number) => labels.get(variantId) ?? `variant ${variantId}`;
  const described = activity.rows.map((event) => ({ event, ...describe(event, labelOf) }));

  const people = new Map<string, { name: string; counts: Record<Kind, number>; last: string }>();
  for (const item of described) {
    const name = item.event.actor?.name ?? 'The system';
    const person = people.get(name) ?? { name, counts: { variants: 0, data: 0, reviews: 0, settings: 0 }, last: item.event.at };
    person.counts[item.kind] += 1;
    if (item.event.at > person.last) person.last = item.event.at;
    people.set(name, person);
  }
  const ranked = [...people.values()].sort((first, second) => (first.last < second.last ? 1 : first.last > second.last ? -1 : first.name.localeCompare(second.name)));

  return (
    <div className="space-y-5">
      <p className="text-sm text-ink-600">
        {activity.total > activity.rows.length
          ? `From the latest ${activity.rows.length} of ${activity.total} recorded changes.`
          : `All ${activity.total} recorded changes.`}
      </p>
      <div className="overflow-x-auto rounded-lg border border-paper-200 bg-white">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Changes per person</caption>
          <thead className="bg-paper-100 text-left text-xs uppercase tracking-wide text-ink-600">
            <tr>
              <th scope="col" className="px-3 py-2 font-semibold">Person</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Variants</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Assays and fits</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Reviews</th>
              <th scope="col" className="px-3 py-2 text-right font-semibold">Settings</th>
              <th scope="col" className="px-3 py-2 font-semibold">Last active</th>
            </tr>
          </thead>
          <tbody className="divide-y divide-paper-200">
            {ranked.map((person) => (
              <tr key={person.name}>
                <th scope="row" className="px-3 py-1.5 text-left font-medium">
                  {person.name}
                </th>
                <td className="numeric px-3 py-1.5 font-mono">{person.counts.variants}</td>
                <td className="numeric px-3 py-1.5 font-mono">{person.counts.data}</td>
                <td className="numeric px-3 py-1.5 font-mono">{person.counts.reviews}</td>
                <td className="numeric px-3 py-1.5 font-mono">{person.counts.settings}</td>
                <td className="whitespace-nowrap px-3 py-1.5 text-ink-600">{formatDateTime(person.last)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div>
        <h3 className="text-sm font-semibold text-ink-900">Latest changes</h3>
        <ol className="mt-2 space-y-2 text-sm">
          {described.slice(0, recentCount).map((item) => (
            <li key={item.event.id} className="flex flex-wrap gap-x-2 border-l-2 border-paper-200 pl-3">
              <span className="font-medium">{item.event.actor?.name ?? 'The system'}</span>
              <span className="text-ink-700">
                {item.variantId !== undefined ? (
                  <Link to={paths.variant.href(item.variantId)} className="text-lagoon-700 underline-offset-2 hover:underline">
                    {item.text}
                  </Link>
                ) : (
                  item.text
                )}
                {item.reason && <span className="text-ink-600"> — “{item.reason}”</span>}
              </span>
              <span className="w-full text-xs text-ink-500">{formatDateTime(item.event.at)}</span>
            </li>
          ))}
        </ol>
      </div>
    </div>
  );
}
