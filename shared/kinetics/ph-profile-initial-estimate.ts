/**
 * Starting values for a pH–rate profile fit, from the data alone.
 *
 * kmax starts at the largest k; each pKa at the pH where the profile, walking away from its maximum,
 * first falls below half of it (linear interpolation between the two neighbouring points), which is
 * where a single ionization's limb has k = kmax/2. A limb that never falls that far starts its pKa at the
 * end of the pH range tested.
 *
 * Reference: Dixon, Biochem. J. 55 (1953) 161 (pKa values read from the profile's inflections);
 * Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param ph pH values
 * @param rateConstant rate constants k at those pH values (unit of kmax), same length
 * @param model `'bell'` (two pKa values), `'acid'` (k rises with pH) or `'base'` (k falls with pH)
 * @throws never; validated data always yield a start
 * @returns [kmax, pKa1, pKa2] for a bell, [kmax, pKa] for one limb
 * @example
 * phProfileInitialEstimate([4, 5, 6, 7, 8], [0.2, 0.6, 1, 0.6, 0.2], 'bell'); // [1, 4.75, 7.25]
 */
export function phProfileInitialEstimate(
  ph: number[],
  rateConstant: number[],
  model: 'bell' | 'acid' | 'base',
): number[] {
  const order = ph.map((_, i) => i).sort((a, b) => ph[a] - ph[b]);
  let peak = 0;
  for (let rank = 1; rank < order.length; rank += 1) {
    if (rateConstant[order[rank]] > rateConstant[order[peak]]) peak = rank;
  }
  const kmax = rateConstant[order[peak]];
  if (model === 'acid') return [kmax, halfMaximumPh(ph, rateConstant, order, peak, -1)];
  if (model === 'base') return [kmax, halfMaximumPh(ph, rateConstant, order, peak, 1)];
  return [kmax, halfMaximumPh(ph, rateConstant, order, peak, -1), halfMaximumPh(ph, rateConstant, order, peak, 1)];
}

/**
 * pH of the first half-maximum crossing walking from the peak (rank `peak` in pH order) towards the acid
 * (−1) or base (+1) end; the end of the range when the profile never falls that far.
 */
function halfMaximumPh(
  ph: number[],
  rateConstant: number[],
  order: number[],
  peak: number,
  direction: -1 | 1,
): number {
  const half = rateConstant[order[peak]] / 2;
  for (let rank = peak + direction; rank >= 0 && rank < order.length; rank += direction) {
    const k = rateConstant[order[rank]];
    if (k < half) {
      const previousK = rateConstant[order[rank - direction]];
      const previousPh = ph[order[rank - direction]];
      return previousPh + ((ph[order[rank]] - previousPh) * (previousK - half)) / (previousK - k);
    }
  }
  return ph[order[direction < 0 ? 0 : order.length - 1]];
}
