import type { RegistryColumnId } from '../registry-view';

/** Column names for the column picker; the grid headers add the units. */
export const columnTitles: Record<RegistryColumnId, string> = {
  label: 'Variant',
  hgvs: 'HGVS',
  positions: 'Positions',
  roles: 'Catalytic role',
  status: 'Status',
  kcat: 'kcat',
  km: 'Km',
  kcatOverKm: 'kcat/Km',
  foldChange: 'Fold change',
  ddg: 'ΔΔG‡ ± SE',
  phOptimum: 'pH optimum',
  measurementCount: 'n (measurements)',
  completeness: 'Reporting completeness',
  flags: 'Flags',
  updated: 'Updated',
};
