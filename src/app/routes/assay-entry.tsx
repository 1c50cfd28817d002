import { Link, useSearchParams } from 'react-router-dom';
import { PageHeader } from '@/components/ui/page-header';
import { LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { AssayEntryWorkspace } from '@/features/assays/components/assay-entry-workspace';
import { useMe } from '@/features/auth/api/get-me';
import { AssayFitCharts } from '@/features/charts/components/assay-fit-charts';

/** A positive whole number from the query string, or null. */
function idParam(value: string | null): number | null {
  return value !== null && /^\d+$/.test(value) && Number(value) > 0 ? Number(value) : null;
}

export default function AssayEntryRoute() {
  const me = useMe();
  const [params] = useSearchParams();
  const variantId = idParam(params.get('variantId'));
  if (!me.data) return <LoadingState />;
  return (
    <div>
      <PageHeader
        title="Assay entry"
        description="Initial rates against substrate concentration, fitted in your browser as you type. On save the server fits the same points with the same code and stores the measurement as a draft."
        actions={
          <Link to={paths.phProfileEntry.href(variantId ?? undefined)} className="inline-flex items-center rounded-md border border-paper-300 bg-white px-3.5 py-2 text-sm font-semibold text-ink-900 hover:bg-paper-100">
            pH profile entry
          </Link>
        }
      />
      <AssayEntryWorkspace userId={me.data.id} initialVariantId={variantId} renderCharts={(input) => <AssayFitCharts {...input} />} />
    </div>
  );
}
