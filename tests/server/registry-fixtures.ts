import { inventedSequence } from '../factories';

/**
 * An invented 300-residue parent (no real protein): the factory filler with Cys45, Ser112, Trp150,
 * His190 and Asp230 placed where the tests annotate and mutate them.
 */
export const parentSequence = inventedSequence(300, { 45: 'C', 112: 'S', 150: 'W', 190: 'H', 230: 'D' });

/** Catalytic sites that match {@link parentSequence}. */
export const parentSites = [
  { position: 45, residue: 'C', role: 'metal ligand' },
  { position: 112, residue: 'S', role: 'nucleophile', expectedPka: 13 },
  { position: 190, residue: 'H', role: 'general base', expectedPka: 6.5 },
  { position: 230, residue: 'D', role: 'electrostatic' },
] as const;

let counter = 0;

/** A unique name for an invented record. */
export const uniqueName = (prefix: string) => `${prefix} ${(counter += 1)}-${Date.now().toString(36)}`;

/** Body of POST /api/enzymes for an invented enzyme on {@link parentSequence}. */
export function enzymeBody(overrides: Record<string, unknown> = {}) {
  return {
    name: uniqueName('Invented amidase'),
    ecNumber: '3.5.1.4',
    organism: 'synthetic construct',
    sequence: parentSequence,
    cofactors: ['Zn2+'],
    sites: parentSites,
    ...overrides,
  };
}

/** Body of POST /api/campaigns on an enzyme. */
export function campaignBody(enzymeId: number, overrides: Record<string, unknown> = {}) {
  return {
    name: uniqueName('Invented campaign'),
    objective: 'Raise activity at mildly acidic pH.',
    enzymeId,
    targetSubstrate: 'invented anilide',
    targetPh: 5.5,
    targetTemperatureC: 37,
    ...overrides,
  };
}
