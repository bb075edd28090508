/** Throws a RangeError unless `value` is a finite number > 0; `name` is the option's name. */
export function positive(name: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new RangeError(`${name} must be a positive finite number (got ${String(value)}).`)
  }
  return value
}

/** Throws a RangeError unless `value` is a finite number ≥ 0. */
export function nonNegative(name: string, value: unknown): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new RangeError(`${name} must be a finite number ≥ 0 (got ${String(value)}).`)
  }
  return value
}

/** Throws unless the input is an object (the optics functions take named values). */
export function assertInput(input: unknown, what: string): void {
  if (input === null || typeof input !== 'object') {
    throw new TypeError(`${what} needs an object of named values.`)
  }
}
