import type { GreyLike, Kernel2D, Signal } from './types'

/** Throws unless `image` has positive integer width and height and width·height samples. */
export function assertGrey(image: GreyLike, what = 'image'): void {
  if (image === null || typeof image !== 'object') {
    throw new TypeError(`The ${what} must be an object with width, height and data.`)
  }
  const { width, height, data } = image
  if (!Number.isInteger(width) || !Number.isInteger(height) || width < 1 || height < 1) {
    throw new RangeError(
      `The ${what} must have positive integer width and height (got ${width} × ${height}).`,
    )
  }
  if (!ArrayBuffer.isView(data)) {
    throw new TypeError(`The ${what} data must be a typed array.`)
  }
  if ((data as ArrayLike<number>).length !== width * height) {
    throw new RangeError(
      `The ${what} data holds ${(data as ArrayLike<number>).length} samples, but ${width} × ${height} needs ${width * height}.`,
    )
  }
}

/** Throws unless `kernel` is a non-empty finite 1-D sequence of odd length. */
export function assertKernel1D(kernel: Signal, what = 'kernel'): void {
  if (kernel === null || typeof kernel !== 'object' || typeof kernel.length !== 'number') {
    throw new TypeError(`The ${what} must be an array of numbers.`)
  }
  if (kernel.length % 2 !== 1) {
    throw new RangeError(
      `The ${what} must have an odd length so that it has a centre sample (got ${kernel.length}).`,
    )
  }
  assertFinite(kernel, what)
}

/** Throws unless `kernel` is a 2-D kernel with odd width and height and finite values. */
export function assertKernel2D(kernel: Kernel2D, what = 'kernel'): void {
  if (kernel === null || typeof kernel !== 'object' || kernel.data === undefined) {
    throw new TypeError(`The ${what} must be an object with width, height and data.`)
  }
  const { width, height, data } = kernel
  if (
    !Number.isInteger(width) ||
    !Number.isInteger(height) ||
    width % 2 !== 1 ||
    height % 2 !== 1
  ) {
    throw new RangeError(
      `The ${what} must have odd width and height so that it has a centre sample (got ${width} × ${height}).`,
    )
  }
  if (data.length !== width * height) {
    throw new RangeError(
      `The ${what} data holds ${data.length} values, but ${width} × ${height} needs ${width * height}.`,
    )
  }
  assertFinite(data, what)
}

/** Throws unless `signal` is a non-empty sequence of finite numbers. */
export function assertSignal(signal: Signal, what = 'signal'): void {
  if (signal === null || typeof signal !== 'object' || typeof signal.length !== 'number') {
    throw new TypeError(`The ${what} must be an array of numbers.`)
  }
  if (signal.length < 1) throw new RangeError(`The ${what} must not be empty.`)
  assertFinite(signal, what)
}

function assertFinite(values: ArrayLike<number>, what: string): void {
  for (let i = 0; i < values.length; i++) {
    if (typeof values[i] !== 'number' || !Number.isFinite(values[i])) {
      throw new RangeError(`The ${what} holds a value that is not a finite number at index ${i}.`)
    }
  }
}
