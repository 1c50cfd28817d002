import { createColumnHelper, flexRender, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { useMemo } from 'react';
import type { CatalyticSiteDto } from '@shared/schemas/enzyme';
import { aminoAcidFromOneLetter } from '@shared/sequence/amino-acids';
import { Button } from '@/components/ui/button';
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
        header: () => <span className="block text-right">Position</span>,
        cell: (info) => <span className="numeric block font-mono">{info.getValue()}</span>,
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
        header: () => <span className="block text-right">Expected pKa</span>,
        cell: (info) => <span className="numeric block font-mono">{info.getValue() === null ? '—' : info.getValue()!.toFixed(1)}</span>,
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
      <div className="overflow-x-auto rounded-lg border border-paper-200 bg-white">
        <table className="min-w-full text-sm">
          <caption className="sr-only">Catalytic sites</caption>
          <thead className="bg-paper-100 text-left text-xs uppercase tracking-wide text-ink-600">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => (
                  <th key={header.id} scope="col" className="px-3 py-2 font-semibold">
                    {flexRender(header.column.columnDef.header, header.getContext())}
                  </th>
                ))}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-paper-200">
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id} className="px-3 py-1.5 align-top">
                    {flexRender(cell.column.columnDef.cell, cell.getContext())}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
