import { describe, expect, it } from 'vitest';
import type { CampaignLandscapeDto } from '@shared/schemas/comparison';
import { filterCells, filtersToSearch, hasVariantFilters, readLandscapeFilters } from '@/features/landscape/lib/landscape-filters';

// An invented landscape of four single substitutions at two positions.
const landscape: CampaignLandscapeDto = {
  campaignId: 1,
  aminoAcids: [...'ACDEFGHIKLMNPQRSTVWY*'],
  positions: [
    { position: 87, parentResidue: 'Y', catalyticRoles: ['electrostatic'] },
    { position: 215, parentResidue: 'R', catalyticRoles: [] },
  ],
  cells: [
    { position: 87, from: 'Y', to: 'F', variantId: 1, label: 'Y87F', status: 'characterized', measurementCount: 2, foldChange: 1.8, log10FoldChange: Math.log10(1.8), ddgKjPerMol: -1.5 },
    { position: 87, from: 'Y', to: 'H', variantId: 2, label: 'Y87H', status: 'purified', measurementCount: 0, foldChange: null, log10FoldChange: null, ddgKjPerMol: null },
    { position: 215, from: 'R', to: 'K', variantId: 3, label: 'R215K', status: 'characterized', measurementCount: 1, foldChange: 0.3, log10FoldChange: Math.log10(0.3), ddgKjPerMol: 3.1 },
    { position: 215, from: 'R', to: 'H', variantId: 4, label: 'R215H', status: 'characterized', measurementCount: 1, foldChange: 0.9, log10FoldChange: Math.log10(0.9), ddgKjPerMol: 0.3 },
  ],
  counts: { singleVariants: 4, measured: 3, withFoldChange: 3, positions: 2, catalyticPositions: 1 },
};

const labels = (search: string) => filterCells(landscape, readLandscapeFilters(new URLSearchParams(search)).filters).map((cell) => cell.label);

describe('readLandscapeFilters', () => {
  it('reads the registry’s parameters with the list API’s schema and ignores sorting and paging', () => {
    const { filters, problems } = readLandscapeFilters(new URLSearchParams('campaignId=2&status=purified,characterized&minFoldChange=1.5&residue=His&sort=km&page=3'));
    expect(problems).toEqual([]);
    expect(filters).toEqual({ campaignId: 2, status: ['purified', 'characterized'], minFoldChange: 1.5, residue: 'H' });
  });

  it('drops a bad value with the schema’s message and keeps the rest', () => {
    const { filters, problems } = readLandscapeFilters(new URLSearchParams('campaignId=2&status=cooked&ddgMin=x'));
    expect(filters).toEqual({ campaignId: 2 });
    expect(problems).toHaveLength(2);
    expect(problems.join(' ')).toMatch(/status: 'cooked' is not a status/);
  });

  it('writes the filters back in the same form', () => {
    const search = 'campaignId=2&status=purified%2Ccharacterized&role=nucleophile';
    const { filters } = readLandscapeFilters(new URLSearchParams(search));
    expect(filtersToSearch(filters)).toBe(search);
    expect(hasVariantFilters(filters)).toBe(true);
    expect(hasVariantFilters({ campaignId: 2 })).toBe(false);
  });
});

describe('filterCells', () => {
  it('applies each filter as the list API does to a single substitution', () => {
    expect(labels('')).toEqual(['Y87F', 'Y87H', 'R215K', 'R215H']);
    expect(labels('status=purified')).toEqual(['Y87H']);
    expect(labels('role=electrostatic')).toEqual(['Y87F', 'Y87H']);
    expect(labels('position=215')).toEqual(['R215K', 'R215H']);
    // The residue matches the parent residue or the new one.
    expect(labels('residue=H')).toEqual(['Y87H', 'R215H']);
    expect(labels('residue=R')).toEqual(['R215K', 'R215H']);
    // Unmeasured variants have no fold change and no ΔΔG‡, so a bound on either leaves them out.
    expect(labels('minFoldChange=0.5')).toEqual(['Y87F', 'R215H']);
    expect(labels('ddgMin=0&ddgMax=3')).toEqual(['R215H']);
    expect(labels('q=y87')).toEqual(['Y87F', 'Y87H']);
  });
});
