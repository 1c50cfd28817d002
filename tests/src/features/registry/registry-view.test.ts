import { describe, expect, it } from 'vitest';
import {
  defaultSort,
  defaultVisibleColumns,
  hasFilters,
  parseRegistryView,
  registryViewSearch,
  variantListParams,
  variantListQuery,
  type RegistryView,
} from '@/features/registry/registry-view';

const parse = (search: string) => parseRegistryView(new URLSearchParams(search));

describe('parseRegistryView', () => {
  it('reads an empty address as the default view', () => {
    expect(parse('')).toEqual({
      view: { filters: {}, sort: defaultSort, columns: [...defaultVisibleColumns] },
      ignored: [],
    });
  });

  it('reads every filter with the list API’s schema, normalising the residue to one letter', () => {
    const { view, ignored } = parse(
      'campaignId=2&position=87&residue=Glu&role=general%20base&status=purified,characterized&minFoldChange=1.5&ddgMin=-8&ddgMax=-0.5&q=pKC&sort=ddg&order=asc',
    );
    expect(ignored).toEqual([]);
    expect(view.filters).toEqual({
      campaignId: 2,
      position: 87,
      residue: 'E',
      role: 'general base',
      status: ['purified', 'characterized'],
      minFoldChange: 1.5,
      ddgMinKJPerMol: -8,
      ddgMaxKJPerMol: -0.5,
      q: 'pKC',
    });
    expect(view.sort).toEqual({ key: 'ddg', order: 'asc' });
  });

  it('drops what it cannot read, says why, and keeps the rest', () => {
    const { view, ignored } = parse('role=catalyst&position=0&minFoldChange=2&sort=colour&ddgMin=1&ddgMax=-1');
    expect(view.filters).toEqual({ minFoldChange: 2, ddgMinKJPerMol: 1 });
    expect(view.sort).toEqual(defaultSort);
    expect(ignored).toHaveLength(4);
    expect(ignored.find((message) => message.startsWith('role=catalyst'))).toMatch(/must be one of nucleophile/);
    expect(ignored.find((message) => message.startsWith('ddgMax=-1'))).toMatch(/must be at least ddgMin/);
  });

  it('takes the sort order the API would when only the key is given', () => {
    expect(parse('sort=label').view.sort).toEqual({ key: 'label', order: 'asc' });
    expect(parse('sort=updated').view.sort).toEqual({ key: 'updated', order: 'desc' });
  });

  it('keeps the label column, the grid’s column order and ignores unknown columns', () => {
    const { view, ignored } = parse('columns=foldChange,ddg,colour');
    expect(view.columns).toEqual(['label', 'ddg', 'foldChange']);
    expect(ignored).toEqual(["columns: 'colour' is not a column"]);
  });
});

describe('registryViewSearch', () => {
  it('writes nothing for the default view', () => {
    expect(registryViewSearch({ filters: {}, sort: defaultSort, columns: [...defaultVisibleColumns] })).toBe('');
  });

  it('round-trips a view through the address', () => {
    const view: RegistryView = {
      filters: { role: 'acid/base', minFoldChange: 1.2, ddgMaxKJPerMol: -4.184, status: ['characterized'], q: 'Y87' },
      sort: { key: 'ddg', order: 'asc' },
      columns: ['label', 'roles', 'ddg', 'foldChange'],
    };
    const search = registryViewSearch(view);
    expect(search).toBe('role=acid%2Fbase&status=characterized&minFoldChange=1.2&ddgMax=-4.184&q=Y87&sort=ddg&order=asc&columns=label%2Croles%2Cddg%2CfoldChange');
    expect(parse(search)).toEqual({ view, ignored: [] });
  });

  it('shortens a converted ΔΔG‡ bound to six significant figures', () => {
    // −0.3 kcal/mol × 4.184 kJ/kcal (thermochemical calorie, NIST SP 811) = −1.2552 kJ/mol
    const search = registryViewSearch({ filters: { ddgMinKJPerMol: -0.3 * 4.184 }, sort: defaultSort, columns: [...defaultVisibleColumns] });
    expect(search).toBe('ddgMin=-1.2552');
  });
});

describe('variantListParams', () => {
  it('asks the API for the page that starts at a row, with the view’s sort', () => {
    expect(variantListParams({ campaignId: 1, residue: 'A' }, { key: 'foldChange', order: 'desc' }, 3, 100)).toEqual({
      campaignId: '1',
      residue: 'A',
      sort: 'foldChange',
      order: 'desc',
      page: '3',
      pageSize: '100',
    });
  });
});

describe('variantListQuery', () => {
  it('gives the view’s filters and sort without a page, as an export of the whole view takes them', () => {
    expect(variantListQuery({ role: 'electrostatic', minFoldChange: 1, status: ['characterized', 'purified'] }, { key: 'ddg', order: 'asc' })).toEqual({
      role: 'electrostatic',
      status: 'characterized,purified',
      minFoldChange: '1',
      sort: 'ddg',
      order: 'asc',
    });
  });
});

describe('hasFilters', () => {
  it('is false for no filters and an empty status list', () => {
    expect(hasFilters({})).toBe(false);
    expect(hasFilters({ status: [] })).toBe(false);
    expect(hasFilters({ q: 'x' })).toBe(true);
  });
});
