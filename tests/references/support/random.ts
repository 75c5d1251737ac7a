/**
 * mulberry32: a small deterministic 32-bit pseudo-random generator (public-domain construction by
 * Tommy Ettinger), so that every randomised check draws the same cases on every run.
 */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Convenience draws on top of a uniform [0, 1) source. */
export class Draw {
  constructor(private readonly next: () => number) {}

  static seeded(seed: number): Draw {
    return new Draw(mulberry32(seed));
  }

  uniform(low: number, high: number): number {
    return low + (high - low) * this.next();
  }

  integer(low: number, high: number): number {
    return low + Math.floor(this.next() * (high - low + 1));
  }

  sign(): 1 | -1 {
    return this.next() < 0.5 ? -1 : 1;
  }

  /** Standard normal by the Box–Muller transform. */
  normal(): number {
    const u = 1 - this.next();
    const v = this.next();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }

  /** 10^uniform(lowExp, highExp). */
  logUniform(lowExp: number, highExp: number): number {
    return 10 ** this.uniform(lowExp, highExp);
  }
}
