/** A small seeded generator (mulberry32), so every generated test problem is reproducible. */
export class SeededRandom {
  private state: number;

  constructor(seed: number) {
    this.state = seed >>> 0;
  }

  /** uniform in [0, 1) */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  }

  uniform(low: number, high: number): number {
    return low + (high - low) * this.next();
  }

  integer(low: number, highInclusive: number): number {
    return low + Math.floor(this.next() * (highInclusive - low + 1));
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  pick<T>(items: readonly T[]): T {
    return items[Math.floor(this.next() * items.length)];
  }

  /** a value rounded to two decimals, so generated data prints and writes compactly */
  round2(low: number, high: number): number {
    return Math.round(this.uniform(low, high) * 100) / 100;
  }
}
