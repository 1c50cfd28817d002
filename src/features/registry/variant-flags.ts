/**
 * Words for the codes in a variant's `flags`: the plausibility flags of its measurements
 * (shared/kinetics/plausibility.ts) and the two the summary adds (incomplete reporting, no matched
 * parent). `short` fits a grid cell; `explanation` is the hover text.
 */
export const variantFlagWords: Record<string, { short: string; explanation: string }> = {
  'above-diffusion-limit': {
    short: 'Above diffusion limit',
    explanation: 'kcat/Km is above 10¹⁰ M⁻¹ s⁻¹, faster than diffusion allows: check units and enzyme concentration.',
  },
  'near-diffusion-limit': { short: 'Near diffusion limit', explanation: 'kcat/Km approaches the diffusion limit (10⁸–10⁹ M⁻¹ s⁻¹).' },
  'km-above-range': {
    short: 'Km above range',
    explanation: 'Km is above the highest substrate concentration tested, so Km and kcat are extrapolated.',
  },
  'range-does-not-span-km': {
    short: 'Range short of Km',
    explanation: 'The substrate range tested does not span 0.2–5 × Km, so Km is poorly determined.',
  },
  'poorly-determined': { short: 'Poorly determined', explanation: 'A fitted parameter has a standard error above 50 % of its value.' },
  'incomplete-reporting': { short: 'Incomplete reporting', explanation: 'A measurement lacks items the STRENDA guidelines ask for.' },
  'no-matched-parent': {
    short: 'No matched parent',
    explanation: 'No parent measurement under matched conditions (same substrate, ±0.5 °C, ±0.1 pH), so no ΔΔG‡ or fold change.',
  },
};

/** The words for a flag code, or the code itself for one this client does not know yet. */
export function flagWords(code: string): { short: string; explanation: string } {
  return variantFlagWords[code] ?? { short: code, explanation: code };
}
