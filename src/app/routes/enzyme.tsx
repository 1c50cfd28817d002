import { useCallback, useState, type ReactNode } from 'react';
import { Link, useParams } from 'react-router-dom';
import { can } from '@shared/auth/permissions';
import { Button } from '@/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useEnzyme } from '@/features/enzymes/api/get-enzyme';
import { AddSiteForm } from '@/features/enzymes/components/add-site-form';
import { EditEnzymeForm } from '@/features/enzymes/components/edit-enzyme-form';
import { EnzymeDetails } from '@/features/enzymes/components/enzyme-details';
import { SitesTable } from '@/features/enzymes/components/sites-table';
import { SequenceMap } from '@/features/sequence-map/components/sequence-map';

function Section({ id, title, actions, children }: { id: string; title: string; actions?: ReactNode; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="space-y-3 rounded-lg border border-paper-200 bg-white p-5 shadow-card">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id={`${id}-heading`} className="text-lg font-semibold text-ink-900">
          {title}
        </h2>
        {actions}
      </div>
      {children}
    </section>
  );
}

export default function EnzymeRoute() {
  const enzymeId = Number(useParams().id);
  const me = useMe();
  const enzyme = useEnzyme(Number.isInteger(enzymeId) && enzymeId > 0 ? enzymeId : undefined);
  const [editing, setEditing] = useState(false);
  const [typedPosition, setTypedPosition] = useState<number | undefined>();
  const handlePositionChange = useCallback((position: number | undefined) => setTypedPosition(position), []);

  if (!Number.isInteger(enzymeId) || enzymeId < 1 || (enzyme.error instanceof ApiError && enzyme.error.status === 404)) {
    return (
      <EmptyState title="There is no such enzyme.">
        See the{' '}
        <Link to={paths.enzymes.href()} className="text-lagoon-700 underline">
          list of enzymes
        </Link>
        .
      </EmptyState>
    );
  }
  if (enzyme.isPending) return <LoadingState label="Loading the enzyme…" />;
  if (enzyme.isError) return <ErrorState error={enzyme.error} onRetry={() => void enzyme.refetch()} />;

  const data = enzyme.data;
  const role = me.data?.role ?? 'viewer';
  const canEdit = can(role, 'variants:write');

  return (
    <div className="space-y-6">
      <header className="flex flex-wrap items-end justify-between gap-4 border-b border-paper-200 pb-4">
        <div>
          <p className="text-sm text-ink-600">
            <Link to={paths.enzymes.href()} className="text-lagoon-700 underline-offset-2 hover:underline">
              Enzymes
            </Link>{' '}
            / parent enzyme
          </p>
          <h1 className="text-2xl font-semibold tracking-tight text-ink-900">{data.name}</h1>
          <p className="mt-1 text-sm text-ink-600">
            EC <span className="font-mono">{data.ecNumber ?? '—'}</span> · {data.organism} · {data.sequenceLength} residues · {data.siteCount}{' '}
            {data.siteCount === 1 ? 'annotated site' : 'annotated sites'}
          </p>
        </div>
        {can(role, 'campaigns:manage') && (
          <Link to={paths.newCampaign.href(data.id)} className="rounded-md bg-ember-500 px-3.5 py-2 text-sm font-semibold text-white hover:bg-ember-600">
            Start a campaign on it
          </Link>
        )}
      </header>

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <Section
          id="enzyme-identity"
          title={editing ? 'Edit the enzyme' : 'Identity'}
          actions={
            canEdit &&
            !editing && (
              <Button className="px-2.5 py-1" onClick={() => setEditing(true)}>
                Edit
              </Button>
            )
          }
        >
          {editing ? <EditEnzymeForm enzyme={data} onDone={() => setEditing(false)} onReload={() => void enzyme.refetch()} /> : <EnzymeDetails enzyme={data} />}
        </Section>
        <Section id="enzyme-campaigns" title="Campaigns">
          {data.campaigns.length === 0 ? (
            <p className="text-sm text-ink-500">No campaign uses this enzyme yet.</p>
          ) : (
            <ul className="space-y-1 text-sm">
              {data.campaigns.map((campaign) => (
                <li key={campaign.id}>
                  <Link to={paths.campaign.href(campaign.id)} className="font-medium text-lagoon-700 underline-offset-2 hover:underline">
                    {campaign.name}
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Section>
      </div>

      <Section id="enzyme-sequence" title="Sequence map">
        <SequenceMap sequence={data.sequence} sites={data.sites} highlightPosition={typedPosition} />
      </Section>

      <Section id="enzyme-sites" title="Catalytic sites">
        <SitesTable sites={data.sites} canEdit={canEdit} />
        {canEdit && <AddSiteForm enzyme={data} onPositionChange={handlePositionChange} />}
      </Section>
    </div>
  );
}
