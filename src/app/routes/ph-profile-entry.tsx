import { Link, useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { paths } from '@/config/paths';
import { PhProfileWorkspace } from '@/features/assays/components/ph-profile-workspace';
import { PhProfileChart } from '@/features/charts/components/ph-profile-chart';

export default function PhProfileEntryRoute() {
  const [params] = useSearchParams();
  const text = params.get('variantId');
  const variantId = text !== null && /^\d+$/.test(text) && Number(text) > 0 ? Number(text) : null;
  return (
    <div>
      <PageHeader
        title="pH profile entry"
        description="A rate against pH, fitted in your browser with the bell-shaped or a single-limb model; pKa values with their standard errors and the annotated residues that might own them. The server refits on save."
        actions={
          <Link to={paths.assayEntry.href(variantId ?? undefined)} className="inline-flex items-center rounded-md border border-paper-300 bg-white px-3.5 py-2 text-sm font-semibold text-ink-900 hover:bg-paper-100">
            Assay entry
          </Link>
        }
      />
      <PhProfileWorkspace initialVariantId={variantId} renderChart={(input) => <PhProfileChart {...input} />} />
    </div>
  );
}
