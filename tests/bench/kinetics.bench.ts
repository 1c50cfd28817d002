// Speed of the kinetics engine: 10,000 generated 12-point Michaelis–Menten data sets and 10,000 bell-shaped
// pH profiles, each fitted once. Prints the median time per fit and the throughput. A benchmark, not a
// test: run with `npm run bench:kinetics`; the figure to beat is SciPy curve_fit's on the same kind of data.
import { fitMichaelisMenten } from '../../shared/kinetics/fit-michaelis-menten';
import { fitPhProfile } from '../../shared/kinetics/fit-ph-profile';
import type { PhPoint, RatePoint } from '../../shared/kinetics/types';

const DATA_SETS = 10_000;
const WARM_UP_SETS = 2_000;
const SEED = 20_250_114;

/** mulberry32: a small, fast, seeded 32-bit generator, so every run fits the same data. */
function seededUniform(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  };
}

const uniform = seededUniform(SEED);
const normal = (): number => Math.sqrt(-2 * Math.log(1 - uniform())) * Math.cos(2 * Math.PI * uniform());
const logUniform = (low: number, high: number): number => Math.exp(Math.log(low) + uniform() * Math.log(high / low));

/** 12 substrate concentrations from 0.2 to 5 × Km, 4 % proportional noise plus 0.5 % of Vmax. */
function michaelisMentenSet(): RatePoint[] {
  const vmax = logUniform(1e-2, 1e3);
  const km = logUniform(1e-6, 1e-1);
  return Array.from({ length: 12 }, (_, i) => {
    const s = 0.2 * km * 25 ** (i / 11);
    const v = (vmax * s) / (km + s);
    return { s, v: v + (0.04 * v + 0.005 * vmax) * normal() };
  });
}

/** pH 3.0 to 10.0 in steps of 0.5, pKa1 in 4–6, pKa2 2–4 units above it, 3 % noise of kmax. */
function bellSet(): PhPoint[] {
  const kmax = logUniform(1e-2, 1e6);
  const pKa1 = 4 + 2 * uniform();
  const pKa2 = pKa1 + 2 + 2 * uniform();
  return Array.from({ length: 15 }, (_, i) => {
    const ph = 3 + i / 2;
    const k = kmax / (1 + 10 ** (pKa1 - ph) + 10 ** (ph - pKa2));
    return { ph, k: k + 0.03 * kmax * normal() };
  });
}

function measure<T>(
  label: string,
  sets: readonly T[],
  fit: (set: T) => { converged: boolean; warnings: string[] },
): void {
  for (let i = 0; i < WARM_UP_SETS; i += 1) fit(sets[i]);

  const nanoseconds = new Float64Array(sets.length);
  let notConverged = 0;
  let withWarnings = 0;
  for (let i = 0; i < sets.length; i += 1) {
    const start = process.hrtime.bigint();
    const result = fit(sets[i]);
    nanoseconds[i] = Number(process.hrtime.bigint() - start);
    if (!result.converged) notConverged += 1;
    if (result.warnings.length > 0) withWarnings += 1;
  }
  nanoseconds.sort();
  const medianMicroseconds = (nanoseconds[(sets.length - 1) >> 1] + nanoseconds[sets.length >> 1]) / 2000;

  // Throughput without the per-fit clock reads.
  const loopStart = process.hrtime.bigint();
  for (const set of sets) fit(set);
  const loopSeconds = Number(process.hrtime.bigint() - loopStart) / 1e9;

  console.log(
    `${label.padEnd(34)} median ${medianMicroseconds.toFixed(2).padStart(6)} µs/fit   ` +
      `${Math.round(sets.length / loopSeconds).toLocaleString('en-US').padStart(9)} fits/s   ` +
      `p90 ${(nanoseconds[Math.floor(0.9 * sets.length)] / 1000).toFixed(2)} µs   ` +
      `not converged ${notConverged}, with warnings ${withWarnings}`,
  );
}

const michaelisMentenSets = Array.from({ length: DATA_SETS }, michaelisMentenSet);
const bellSets = Array.from({ length: DATA_SETS }, bellSet);

console.log(`kinetics engine, Node ${process.version}, ${DATA_SETS.toLocaleString('en-US')} data sets each`);
measure('Michaelis–Menten (12 points)', michaelisMentenSets, (points) => fitMichaelisMenten(points));
measure('pH profile, bell (15 points)', bellSets, (points) => fitPhProfile(points, { model: 'bell' }));
