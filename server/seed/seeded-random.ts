/**
 * A small deterministic random source for generated data (demo and scale seeds), so every fresh
 * database holds the same numbers. mulberry32 for uniforms, Box–Muller for normals.
 */
export function seededRandom(seed: number) {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    const u = Math.max(uniform(), Number.EPSILON);
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
  const pick = <T>(items: readonly T[]): T => items[Math.floor(uniform() * items.length)];
  return { uniform, normal, pick };
}

export type SeededRandom = ReturnType<typeof seededRandom>;
