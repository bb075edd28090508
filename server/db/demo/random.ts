// A small seeded generator so the demo scenario is the same on every machine.

export interface Rng {
  next(): number
  between(min: number, max: number): number
  int(min: number, max: number): number
  normal(mean: number, sd: number): number
  pick<T>(items: readonly T[]): T
  uuid(): string
}

/** mulberry32 (public-domain 32-bit generator), with helpers. */
export function createRng(seed: number): Rng {
  let a = seed >>> 0
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
  const rng: Rng = {
    next,
    between: (min, max) => min + (max - min) * next(),
    int: (min, max) => min + Math.floor((max - min + 1) * next()),
    normal(mean, sd) {
      // Box–Muller
      const u = Math.max(next(), 1e-12)
      const v = next()
      return mean + sd * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v)
    },
    pick: (items) => items[Math.floor(next() * items.length)],
    uuid() {
      const hex = Array.from({ length: 32 }, () => Math.floor(next() * 16).toString(16))
      hex[12] = '4'
      hex[16] = ((parseInt(hex[16], 16) & 0x3) | 0x8).toString(16)
      const s = hex.join('')
      return `${s.slice(0, 8)}-${s.slice(8, 12)}-${s.slice(12, 16)}-${s.slice(16, 20)}-${s.slice(20)}`
    },
  }
  return rng
}
