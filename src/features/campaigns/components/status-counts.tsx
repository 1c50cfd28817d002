import { Link } from 'react-router-dom';
import type { CampaignDto } from '@shared/schemas/campaign';
import { variantStatuses } from '@shared/schemas/variant';
import { paths } from '@/config/paths';

const statusText = (status: string) => status.charAt(0).toUpperCase() + status.slice(1);

/**
 * The campaign's variants by construct status, in pipeline order, each a link to the registry filtered to
 * it; bars are scaled to the largest count and every bar carries its number.
 */
export function StatusCounts({ campaign }: { campaign: CampaignDto }) {
  const largest = Math.max(1, ...variantStatuses.map((status) => campaign.variantCounts[status]));
  return (
    <div className="space-y-2">
      <p className="text-sm text-ink-600">
        <span className="font-mono text-lg font-semibold tabular-nums text-ink-900">{campaign.variantTotal}</span> variants, the parent included.
      </p>
      <table className="w-full text-sm">
        <caption className="sr-only">Variants by status</caption>
        <tbody>
          {variantStatuses.map((status) => {
            const count = campaign.variantCounts[status];
            return (
              <tr key={status}>
                <th scope="row" className="w-40 py-1 pr-3 text-left font-normal">
                  {count > 0 ? (
                    <Link
                      to={paths.registry.href(new URLSearchParams({ campaignId: String(campaign.id), status }).toString())}
                      className="text-lagoon-700 underline-offset-2 hover:underline"
                    >
                      {statusText(status)}
                    </Link>
                  ) : (
                    <span className="text-ink-500">{statusText(status)}</span>
                  )}
                </th>
                <td className="w-12 py-1 pr-3 text-right font-mono tabular-nums">{count}</td>
                <td className="py-1" aria-hidden>
                  <span className="block h-2.5 rounded-sm bg-lagoon-600" style={{ width: `${(count / largest) * 100}%`, minWidth: count > 0 ? '2px' : 0 }} />
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
