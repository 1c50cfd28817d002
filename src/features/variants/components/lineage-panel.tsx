import { Link } from 'react-router-dom';
import type { VariantDto, VariantRefDto } from '@shared/schemas/variant';
import { paths } from '@/config/paths';
import { VariantStatusBadge } from './variant-status-badge';

interface LineagePanelProps {
  variant: VariantDto;
  /** The campaign's parent variant, the root of every lineage. */
  campaignParent: { id: number; label: string } | null;
}

/** Where the variant came from (its parent variant, or the campaign's parent) and what was made from it. */
export function LineagePanel({ variant, campaignParent }: LineagePanelProps) {
  const { parent, children, childCount } = variant.lineage;
  return (
    <div className="space-y-3 text-sm">
      <div>
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-600">Made from</h3>
        {parent ? (
          <VariantLink variant={parent} />
        ) : variant.isParent ? (
          <p className="mt-1 text-ink-700">Nothing: this is the root of the campaign&apos;s lineage.</p>
        ) : campaignParent ? (
          <p className="mt-1 text-ink-700">
            The campaign&apos;s{' '}
            <Link to={paths.variant.href(campaignParent.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
              parent
            </Link>{' '}
            (no parent variant recorded).
          </p>
        ) : (
          <p className="mt-1 text-ink-500">No parent variant recorded.</p>
        )}
      </div>
      <div>
        <h3 className="text-xs font-semibold uppercase tracking-wide text-ink-600">
          Made from this one{childCount > 0 && <span className="font-normal normal-case"> ({childCount})</span>}
        </h3>
        {children.length === 0 ? (
          <p className="mt-1 text-ink-500">No variants yet.</p>
        ) : (
          <ul className="mt-1 space-y-1">
            {children.map((child) => (
              <li key={child.id}>
                <VariantLink variant={child} />
              </li>
            ))}
          </ul>
        )}
        {childCount > children.length && <p className="mt-1 text-xs text-ink-500">and {childCount - children.length} more, listed in the registry.</p>}
      </div>
    </div>
  );
}

function VariantLink({ variant }: { variant: VariantRefDto }) {
  return (
    <span className="mt-1 flex flex-wrap items-center gap-2">
      <Link to={paths.variant.href(variant.id)} className="font-mono font-semibold text-lagoon-700 underline-offset-2 hover:underline">
        {variant.label}
      </Link>
      <VariantStatusBadge status={variant.status} />
    </span>
  );
}
