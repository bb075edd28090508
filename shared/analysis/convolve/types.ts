/**
 * A grey image as the analysis code sees it: row-major samples, `data[y * width + x]`.
 * Any object of this shape works (the image module's own types included).
 */
export interface GreyLike {
  width: number
  height: number
  data: Float32Array | Float64Array | Uint8Array | Uint16Array
}

/** A 2-D kernel, row-major, odd width and height; the centre sample sits at (width >> 1, height >> 1). */
export interface Kernel2D {
  width: number
  height: number
  data: ArrayLike<number>
}

/** A 1-D sequence of numbers (plain array or typed array). */
export type Signal = ArrayLike<number>
