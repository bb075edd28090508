/**
 * Scratch buffers of the edge search, kept between calls and grown on demand. A fresh 10–50 MB
 * typed array costs more in page faults than the pass that fills it, so frame-sized temporaries
 * are reused. Safe because the search is synchronous and single-threaded (one per worker);
 * nothing returned to callers aliases these buffers.
 */
export interface EdgeScratch {
  small: Float32Array
  mag: Float32Array
  kind: Uint8Array
  queue: Int32Array
  runSize: Uint16Array
}

let cached: EdgeScratch | null = null

/** Scratch for a downsampled frame of `pixels` samples; contents are left from the last call. */
export function edgeScratch(pixels: number): EdgeScratch {
  if (!cached || cached.mag.length < pixels) {
    cached = {
      small: new Float32Array(pixels),
      mag: new Float32Array(pixels),
      kind: new Uint8Array(pixels),
      queue: new Int32Array(pixels),
      runSize: new Uint16Array(pixels),
    }
  }
  return cached
}
