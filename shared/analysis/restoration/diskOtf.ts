/**
 * Bessel function of the first kind, order 1, by the rational and asymptotic approximations of
 * Numerical Recipes in C, 2nd ed., §6.5 (bessj1); absolute error about 1e-8.
 */
export function besselJ1(x: number): number {
  const ax = Math.abs(x)
  if (ax < 8) {
    const y = x * x
    const num =
      x *
      (72362614232.0 +
        y *
          (-7895059235.0 +
            y * (242396853.1 + y * (-2972611.439 + y * (15704.4826 + y * -30.16036606)))))
    const den =
      144725228442.0 +
      y * (2300535178.0 + y * (18583304.74 + y * (99447.43394 + y * (376.9991397 + y))))
    return num / den
  }
  const z = 8 / ax
  const y = z * z
  const xx = ax - 2.356194491
  const p =
    1 + y * (0.183105e-2 + y * (-0.3516396496e-4 + y * (0.2457520174e-5 + y * -0.240337019e-6)))
  const q =
    0.04687499995 +
    y * (-0.2002690873e-3 + y * (0.8449199096e-5 + y * (-0.88228987e-6 + y * 0.105787412e-6)))
  const ans = Math.sqrt(2 / (Math.PI * ax)) * (Math.cos(xx) * p - z * Math.sin(xx) * q)
  return x < 0 ? -ans : ans
}

/**
 * Optical transfer function of a uniform defocus disk of radius R px (Goodman, Introduction to
 * Fourier Optics): OTF(f) = 2·J1(2πRf) / (2πRf), f in cycles/pixel. Signed: negative lobes are
 * contrast reversal. Zeros at 0.609835/R, 1.116557/R, … (zeros of J1 divided by 2π).
 */
export function diskOtf(radiusPx: number): (fCyPx: number) => number {
  if (!Number.isFinite(radiusPx) || radiusPx <= 0) {
    throw new RangeError(`The disk radius must be a positive number of pixels (got ${radiusPx}).`)
  }
  return (f) => {
    const a = 2 * Math.PI * radiusPx * f
    return Math.abs(a) < 1e-8 ? 1 : (2 * besselJ1(a)) / a
  }
}
