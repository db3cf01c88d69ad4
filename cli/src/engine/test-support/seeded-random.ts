// Seeded pseudo-random numbers for reproducible synthetic series in tests and benchmarks.
// mulberry32 (a 32-bit generator by Tommy Ettinger, public domain) and the Box–Muller transform.

export interface SeededRandom {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Standard normal. */
  normal(): number;
}

export function seededRandom(seed: number): SeededRandom {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (): number => {
    const u = 1 - uniform(); // (0, 1]
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * uniform());
  };
  return { uniform, normal };
}

/** n draws of mean + sd · N(0, 1). */
export function normalSeries(random: SeededRandom, n: number, mean: number, sd: number): Float64Array {
  return Float64Array.from({ length: n }, () => mean + sd * random.normal());
}
