/**
 * Move the zero frequency from index 0 to the centre (index ⌊n/2⌋ per axis), like numpy.fft.fftshift,
 * for display. `data` is row-major width × height.
 */
export function fftShift2d(data: ArrayLike<number>, width: number, height: number): Float64Array {
  if (data.length !== width * height) {
    throw new RangeError(
      `The data holds ${data.length} values, but ${width} × ${height} needs ${width * height}.`,
    )
  }
  const out = new Float64Array(width * height)
  const sx = width >> 1
  const sy = height >> 1
  for (let y = 0; y < height; y++) {
    const ty = (y + sy) % height
    for (let x = 0; x < width; x++) out[ty * width + ((x + sx) % width)] = data[y * width + x]
  }
  return out
}

/**
 * Frequency in cycles/pixel of DFT bin k of an n-point transform, signed like numpy.fft.fftfreq:
 * k/n for k < ⌈n/2⌉, otherwise (k − n)/n (so bin n/2 of an even n is −0.5).
 */
export function fftFrequencyCyPx(k: number, n: number): number {
  return k < Math.ceil(n / 2) ? k / n : (k - n) / n
}
