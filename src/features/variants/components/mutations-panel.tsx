import { formatMutation, formatMutationHgvs } from '@shared/mutations/format-mutations';
import type { VariantDto } from '@shared/schemas/variant';
import { formatPh } from '@/lib/format';

const sentenceCase = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);

/** Each substitution in shorthand and HGVS, with what the parent residue does there when it is annotated. */
export function MutationsPanel({ variant }: { variant: VariantDto }) {
  if (variant.isParent) {
    return (
      <p className="text-sm text-ink-700">
        This is the campaign&apos;s parent: no substitutions (<span className="font-mono">{variant.hgvs}</span>). Every other variant is compared
        with it.
      </p>
    );
  }
  return (
    <table className="w-full text-sm">
      <caption className="sr-only">Substitutions of {variant.label}</caption>
      <thead className="text-left text-xs uppercase tracking-wide text-ink-600">
        <tr>
          <th scope="col" className="py-1 pr-3 font-semibold">Change</th>
          <th scope="col" className="py-1 pr-3 font-semibold">HGVS</th>
          <th scope="col" className="py-1 font-semibold">Annotated site</th>
        </tr>
      </thead>
      <tbody className="divide-y divide-paper-200">
        {variant.mutations.map((mutation) => {
          const sites = variant.catalyticSites.filter((site) => site.position === mutation.position);
          return (
            <tr key={mutation.position} className="align-top">
              <td className="py-1.5 pr-3 font-mono font-semibold">{formatMutation(mutation)}</td>
              <td className="py-1.5 pr-3 font-mono text-ink-700">{formatMutationHgvs([mutation])}</td>
              <td className="py-1.5 text-ink-700">
                {sites.length === 0 ? (
                  <span className="text-ink-500">none</span>
                ) : (
                  sites.map((site) => (
                    <span key={site.id} className="block">
                      {sentenceCase(site.role)}
                      {site.expectedPka !== null && <> · pKa {formatPh(site.expectedPka)}</>}
                      {site.note && <span className="block text-xs text-ink-500">{site.note}</span>}
                    </span>
                  ))
                )}
              </td>
            </tr>
          );
        })}
      </tbody>
    </table>
  );
}
