import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import type { CatalyticSiteDto } from '@shared/schemas/enzyme';
import { aminoAcidFromOneLetter } from '@shared/sequence/amino-acids';
import { Button } from '@/components/ui/button';
import { DataTable } from '@/components/ui/data-table';
import { Notice } from '@/components/ui/notice';
import { EmptyState } from '@/components/ui/states';
import { useDeleteSite } from '../api/delete-site';

const column = createColumnHelper<CatalyticSiteDto>();

/** The annotated residues by position; those who may edit can remove one. */
export function SitesTable({ sites, canEdit }: { sites: readonly CatalyticSiteDto[]; canEdit: boolean }) {
  const deleteSite = useDeleteSite();
  const hasNotes = sites.some((site) => site.note);
  const columns = useMemo(
    () => [
      column.accessor('position', {
        header: 'Position',
        cell: (info) => <span className="font-mono">{info.getValue()}</span>,
        meta: { numeric: true },
      }),
      column.accessor('residue', {
        header: 'Residue',
        cell: (info) => (
          <span className="font-mono">
            {aminoAcidFromOneLetter(info.getValue())?.threeLetter ?? info.getValue()} ({info.getValue()})
          </span>
        ),
      }),
      column.accessor('role', { header: 'Role', cell: (info) => info.getValue().charAt(0).toUpperCase() + info.getValue().slice(1) }),
      column.accessor('expectedPka', {
        header: 'Expected pKa',
        cell: (info) => <span className="font-mono">{info.getValue() === null ? '—' : info.getValue()!.toFixed(1)}</span>,
        meta: { numeric: true },
      }),
      ...(hasNotes ? [column.accessor('note', { header: 'Note', cell: (info) => <span className="text-ink-600">{info.getValue() ?? ''}</span> })] : []),
      ...(canEdit
        ? [
            column.display({
              id: 'remove',
              header: () => <span className="sr-only">Remove</span>,
              cell: (info) => {
                const site = info.row.original;
                return (
                  <Button
                    variant="quiet"
                    className="px-2 py-1 text-xs"
                    disabled={deleteSite.isPending}
                    aria-label={`Remove the ${site.role} annotation at ${site.residue}${site.position}`}
                    onClick={() => deleteSite.mutate({ enzymeId: site.enzymeId, siteId: site.id })}
                  >
                    Remove
                  </Button>
                );
              },
            }),
          ]
        : []),
    ],
    [canEdit, deleteSite, hasNotes],
  );
  const table = useReactTable({ data: sites as CatalyticSiteDto[], columns, getCoreRowModel: getCoreRowModel(), getRowId: (row) => String(row.id) });

  if (sites.length === 0) return <EmptyState title="No catalytic sites annotated yet." />;
  return (
    <div className="space-y-2">
      {deleteSite.isError && <Notice tone="danger" title="The site could not be removed">{deleteSite.error.message}</Notice>}
      <DataTable table={table} caption="Catalytic sites" variant="inset" />
    </div>
  );
}
