/**
 * The demo campaign, entirely invented: a thermostable amidase from a fictional thermophile, an
 * invented 300-residue sequence, and a campaign to raise its activity at mildly acidic pH. Effects are
 * set to look like a real campaign: parent kcat ≈ 10 s⁻¹ and Km ≈ 1 mM at pH 7.5, removing the
 * nucleophile costs ~10⁴ in kcat, second-shell changes move things a few fold, and a handful of
 * changes near the general base lower its pKa and so help at pH 5.5.
 */
import type { CatalyticRole } from '@shared/schemas/enzyme';
import { seededRandom } from './seeded-random';

const sequenceLength = 300;

/** Residues placed at annotated positions; everything else is drawn at random. */
export const demoSites: readonly { position: number; residue: string; role: CatalyticRole; expectedPka?: number; note: string }[] = [
  { position: 64, residue: 'E', role: 'acid/base', expectedPka: 4.5, note: 'Protonates the leaving amine, then activates water' },
  { position: 87, residue: 'Y', role: 'electrostatic', note: 'Second shell: hydrogen bond to the general base' },
  { position: 112, residue: 'C', role: 'nucleophile', expectedPka: 8.3, note: 'Attacks the amide carbonyl (thioester intermediate)' },
  { position: 141, residue: 'N', role: 'oxyanion hole', note: 'Side-chain NH2 stabilises the tetrahedral intermediate' },
  { position: 160, residue: 'W', role: 'substrate binding', note: 'Stacks on the acyl chain' },
  { position: 190, residue: 'H', role: 'general base', expectedPka: 6.6, note: 'Deprotonates the nucleophile' },
  { position: 215, residue: 'R', role: 'substrate binding', note: 'Salt bridge to the substrate carbonyl region' },
  { position: 228, residue: 'D', role: 'metal ligand', note: 'Zn2+ ligand; the metal orients the general base' },
];

// Composition close to an average soluble protein, so the invented sequence reads like one.
const composition = 'AAAAAAAAGGGGGGGLLLLLLLLLVVVVVVVEEEEEEKKKKKKSSSSSTTTTTDDDDDRRRRRIIIIIPPPPNNNNQQQQFFFFYYYMMHHCW';

/** The invented parent sequence; deterministic, starts with Met, annotated residues in place. */
export function demoSequence(): string {
  const random = seededRandom(20261201);
  const residues = Array.from({ length: sequenceLength }, (_, index) => (index === 0 ? 'M' : random.pick([...composition])));
  for (const site of demoSites) residues[site.position - 1] = site.residue;
  // Keep Cys rare and away from annotated sites so the nucleophile stays the obvious one.
  return residues.map((residue, index) => (residue === 'C' && index !== 111 ? 'S' : residue)).join('');
}

export interface DemoVariantPlan {
  mutations: string;
  status: 'designed' | 'cloned' | 'sequence-verified' | 'expressed' | 'purified' | 'characterized' | 'failed' | 'archived';
  /** Multiplies the parent's kcat (at the pH-independent plateau). */
  kcatFactor: number;
  /** Multiplies the parent's Km. */
  kmFactor: number;
  /** Shift of the acidic-limb pKa (general base) in pH units. */
  pka1Shift: number;
  notes?: string;
  constructId: string;
  /** Gets a pH profile in the demo. */
  phProfile?: boolean;
}

const saturation87: [string, number, number, number][] = [
  ['Y87F', 0.9, 1.1, -0.1],
  ['Y87H', 0.7, 1.4, -0.4],
  ['Y87D', 0.6, 1.3, -0.9],
  ['Y87E', 0.75, 1.2, -0.7],
  ['Y87A', 0.4, 1.8, 0.1],
  ['Y87S', 0.55, 1.5, -0.2],
  ['Y87L', 0.5, 0.9, 0.3],
  ['Y87W', 0.3, 2.5, 0.2],
  ['Y87N', 0.65, 1.3, -0.3],
  ['Y87Q', 0.7, 1.2, -0.35],
];

const saturation215: [string, number, number, number][] = [
  ['R215K', 0.8, 3.1, 0],
  ['R215A', 0.35, 9.5, 0],
  ['R215Q', 0.5, 6.2, 0],
  ['R215H', 0.6, 4.0, -0.2],
  ['R215M', 0.45, 7.0, 0],
  ['R215E', 0.15, 20, 0.2],
  ['R215S', 0.4, 8.0, 0],
  ['R215N', 0.5, 5.5, 0],
];

/** About forty variants: catalytic-site singles, two saturation series, and combinations for cycles. */
export function demoVariantPlans(): DemoVariantPlan[] {
  let construct = 100;
  const next = () => `pKC-${(construct += 1)}`;
  const characterized = (mutations: string, kcatFactor: number, kmFactor: number, pka1Shift = 0, extra: Partial<DemoVariantPlan> = {}): DemoVariantPlan => ({
    mutations,
    status: 'characterized',
    kcatFactor,
    kmFactor,
    pka1Shift,
    constructId: next(),
    ...extra,
  });
  return [
    characterized('C112A', 1.2e-4, 0.8, 0, { notes: 'Nucleophile removed: residual activity only.' }),
    characterized('C112S', 8e-4, 1.1),
    characterized('H190N', 3e-3, 1.3, 0, { notes: 'General base removed.' }),
    characterized('H190A', 1.1e-3, 1.5),
    characterized('E64Q', 1.5e-2, 1.6),
    characterized('E64D', 0.22, 1.2, 0.2),
    characterized('N141A', 0.035, 2.2),
    characterized('W160F', 0.75, 1.6),
    characterized('D228N', 0.02, 1.4, 0, { notes: 'Metal ligand weakened; activity depends on added Zn2+.' }),
    ...saturation87.map(([mutations, kcat, km, shift]) => characterized(mutations, kcat, km, shift, { phProfile: ['Y87D', 'Y87E', 'Y87H'].includes(mutations) })),
    ...saturation215.map(([mutations, kcat, km, shift]) => characterized(mutations, kcat, km, shift)),
    // Combinations for double-mutant cycles: some additive, some coupled.
    characterized('Y87F/R215K', 0.72, 3.4, -0.1),
    characterized('Y87D/R215K', 0.65, 3.0, -0.95, { phProfile: true, notes: 'Best candidate so far at pH 5.5.' }),
    characterized('Y87E/W160F', 0.38, 2.9, -0.6, { notes: 'Less than additive: the two side chains compete for the same pocket.' }),
    characterized('E64D/Y87F', 0.2, 1.3, 0.1),
    characterized('Y87D/W160F/R215K', 0.5, 4.6, -0.9),
    // Variants still in the pipeline, without data.
    { mutations: 'D228A', status: 'failed', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next(), notes: 'Insoluble on expression at 37 °C and at 25 °C.' },
    { mutations: 'Y87D/R215H', status: 'purified', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'Y87E/R215K', status: 'expressed', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'H190Q', status: 'sequence-verified', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'N141D', status: 'cloned', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'Y87D/N141Q', status: 'designed', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'W160Y', status: 'designed', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next() },
    { mutations: 'R215P', status: 'archived', kcatFactor: 1, kmFactor: 1, pka1Shift: 0, constructId: next(), notes: 'Dropped: proline breaks the helix in the model.' },
  ];
}

/** Parent kinetics at the pH-independent plateau, and its ionisations (general base, then a basic group). */
export const demoParent = {
  kcatPerSecond: 11,
  kmMolar: 1.0e-3,
  pka1: 6.6,
  pka2: 9.4,
};

/** The campaign's target conditions and the second condition set some assays were run at. */
export const demoConditions = {
  substrate: 'N-butanoyl-4-nitroaniline',
  target: { ph: 5.5, temperatureC: 45 },
  reference: { ph: 7.5, temperatureC: 45 },
};

/** The fraction of activity left at a pH for a bell-shaped profile (two ionisations). */
export function bellFraction(ph: number, pka1: number, pka2: number): number {
  return 1 / (1 + 10 ** (pka1 - ph) + 10 ** (ph - pka2));
}
