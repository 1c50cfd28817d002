import { createColumnHelper, getCoreRowModel, useReactTable, type RowSelectionState } from '@tanstack/react-table';
import type { ReactElement } from 'react';
import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { DataTable, type DataTableProps } from '@/components/ui/data-table';

// Invented plumbing fixture.
interface Site {
  id: number;
  residue: string;
  position: number;
}

const sites: Site[] = [
  { id: 1, residue: 'Glu', position: 64 },
  { id: 2, residue: 'Cys', position: 112 },
];

const column = createColumnHelper<Site>();
const columns = [
  column.accessor('residue', { header: 'Residue' }),
  column.accessor('position', { header: 'Position', meta: { numeric: true } }),
];

function SitesFixture({ selection = {}, ...props }: { selection?: RowSelectionState } & Omit<DataTableProps<Site>, 'table' | 'caption'>) {
  const table = useReactTable({ data: sites, columns, getCoreRowModel: getCoreRowModel(), getRowId: (site) => String(site.id), state: { rowSelection: selection } });
  return <DataTable table={table} caption="Catalytic sites" {...props} />;
}

const render = (element: ReactElement) => renderToStaticMarkup(element);
const rows = (markup: string) => [...markup.matchAll(/<tr( class="[^"]*")?>(.*?)<\/tr>/g)].map((match) => ({ className: match[1] ?? '', html: match[2] }));

describe('DataTable', () => {
  it('names the table for screen readers and writes a header row and one row per record', () => {
    const markup = render(<SitesFixture />);
    expect(markup).toContain('<caption class="sr-only">Catalytic sites</caption>');
    expect(markup.match(/<th scope="col"/g)).toHaveLength(2);
    const [header, ...body] = rows(markup);
    expect(header.html).toContain('Residue');
    expect(body.map((row) => row.html.replace(/<[^>]+>/g, '|'))).toEqual(['|Glu||64|', '|Cys||112|']);
  });

  it('right-aligns a numeric column, header and cells, and no other', () => {
    const markup = render(<SitesFixture />);
    expect(markup).toMatch(/<th scope="col" class="[^"]*text-right[^"]*">Position<\/th>/);
    expect(markup).not.toMatch(/<th scope="col" class="[^"]*text-right[^"]*">Residue<\/th>/);
    expect(markup).toMatch(/<td class="[^"]*numeric[^"]*">64<\/td>/);
    expect(markup).not.toMatch(/<td class="[^"]*numeric[^"]*">Glu<\/td>/);
  });

  it('tints selected rows and adds the caller’s row classes, leaving other rows without a class', () => {
    const markup = render(<SitesFixture selection={{ 2: true }} rowClassName={(row) => (row.original.position < 100 ? 'text-ink-600' : undefined)} />);
    const [, first, second] = rows(markup);
    expect(first.className).toBe(' class="text-ink-600"');
    expect(second.className).toBe(' class="bg-lagoon-50"');
    expect(rows(render(<SitesFixture />)).slice(1).map((row) => row.className)).toEqual(['', '']);
  });

  it('aligns cells to the top unless asked to centre them', () => {
    expect(render(<SitesFixture />)).toMatch(/<td class="[^"]*align-top/);
    const centred = render(<SitesFixture cellAlign="middle" />);
    expect(centred).toMatch(/<td class="[^"]*align-middle/);
    expect(centred).not.toContain('align-top');
  });
});
