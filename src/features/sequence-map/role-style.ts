import type { CatalyticRole } from '@shared/schemas/enzyme';

/**
 * Theme classes and a one-letter mark per catalytic role, so the map never relies on colour alone. The
 * letter on each fill is the darker or lighter ink, whichever reaches 4.5:1 (WCAG 2.1 AA, normal text);
 * the nucleophile fill is used at 80 % on white because neither ink reaches it on the full orange.
 */
export const roleStyle: Record<CatalyticRole, { fill: string; ring: string; mark: string; label: string; darkText: boolean }> = {
  nucleophile: { fill: 'bg-role-nucleophile/80', ring: 'ring-role-nucleophile', mark: 'N', label: 'Nucleophile', darkText: true },
  'general acid': { fill: 'bg-role-general-acid', ring: 'ring-role-general-acid', mark: 'A', label: 'General acid', darkText: true },
  'general base': { fill: 'bg-role-general-base', ring: 'ring-role-general-base', mark: 'B', label: 'General base', darkText: false },
  'acid/base': { fill: 'bg-role-acid-base', ring: 'ring-role-acid-base', mark: 'AB', label: 'Acid/base', darkText: true },
  'metal ligand': { fill: 'bg-role-metal-ligand', ring: 'ring-role-metal-ligand', mark: 'M', label: 'Metal ligand', darkText: true },
  'oxyanion hole': { fill: 'bg-role-oxyanion-hole', ring: 'ring-role-oxyanion-hole', mark: 'O', label: 'Oxyanion hole', darkText: true },
  'substrate binding': { fill: 'bg-role-substrate-binding', ring: 'ring-role-substrate-binding', mark: 'S', label: 'Substrate binding', darkText: true },
  electrostatic: { fill: 'bg-role-electrostatic', ring: 'ring-role-electrostatic', mark: 'E', label: 'Electrostatic', darkText: false },
  other: { fill: 'bg-role-other', ring: 'ring-role-other', mark: '·', label: 'Other', darkText: true },
};
