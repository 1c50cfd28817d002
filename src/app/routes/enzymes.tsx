import { Link } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { useMe } from '@/features/auth/api/get-me';
import { useEnzymes } from '@/features/enzymes/api/get-enzymes';
import { EnzymesTable } from '@/features/enzymes/components/enzymes-table';

export default function EnzymesRoute() {
  const me = useMe();
  const enzymes = useEnzymes();
  const canCreate = me.data ? can(me.data.role, 'variants:write') : false;
  return (
    <div>
      <PageHeader
        title="Enzymes"
        description="The parent enzymes campaigns start from: their identity, sequence and annotated catalytic residues."
        actions={
          canCreate && (
            <Link to={paths.newEnzyme.href()} className="rounded-md bg-ember-500 px-3.5 py-2 text-sm font-semibold text-white hover:bg-ember-600">
              New enzyme
            </Link>
          )
        }
      />
      {enzymes.isPending && <LoadingState label="Loading enzymes…" />}
      {enzymes.isError && <ErrorState error={enzymes.error} onRetry={() => void enzymes.refetch()} />}
      {enzymes.data && enzymes.data.rows.length === 0 && (
        <EmptyState title="No enzymes yet.">
          {canCreate ? (
            <Link to={paths.newEnzyme.href()} className="text-lagoon-700 underline">
              Add the first parent enzyme
            </Link>
          ) : (
            'A biologist or lead adds the parent enzymes.'
          )}
        </EmptyState>
      )}
      {enzymes.data && enzymes.data.rows.length > 0 && <EnzymesTable enzymes={enzymes.data.rows} />}
    </div>
  );
}
