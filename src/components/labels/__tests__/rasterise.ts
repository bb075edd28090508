// A tiny rasteriser for the filled and stroked rectangles of one of our PDF pages: it follows the
// content stream the way a reader does (the `cm` transform, `rg` colours, `re` paths filled by `f`
// or stroked by `S`) and paints a grey image of one part of the page. Text is not drawn: the test
// reads QR codes, which the PDF draws with rectangles only.

export interface GreyImage {
  width: number
  height: number
  /** 0 = black … 255 = white, row by row. */
  grey: Uint8ClampedArray
}

type Matrix = [number, number, number, number, number, number]

/** `area` is in PDF points from the page's bottom-left corner; `dpi` sets the pixel size. */
export function rasteriseRects(
  content: string,
  area: { x: number; y: number; w: number; h: number },
  dpi: number,
): GreyImage {
  const scale = dpi / 72
  const width = Math.round(area.w * scale)
  const height = Math.round(area.h * scale)
  const grey = new Uint8ClampedArray(width * height).fill(255)
  let ctm: Matrix = [1, 0, 0, 1, 0, 0]
  let fill = 0
  let strokeGrey = 0
  let lineWidth = 1
  let path: number[][] = []

  /** Paints a user-space rectangle (any orientation the transform gives it). */
  const paint = (x: number, y: number, w: number, h: number, value: number) => {
    const [a, b, c, d, e, f] = ctm
    const xs = [x, x + w].flatMap((px) => [y, y + h].map((py) => a * px + c * py + e))
    const ys = [x, x + w].flatMap((px) => [y, y + h].map((py) => b * px + d * py + f))
    // Device pixels whose centres fall inside the rectangle (y flipped: images run top-down).
    const x0 = Math.ceil((Math.min(...xs) - area.x) * scale - 0.5)
    const x1 = Math.floor((Math.max(...xs) - area.x) * scale - 0.5)
    const y0 = Math.ceil((area.y + area.h - Math.max(...ys)) * scale - 0.5)
    const y1 = Math.floor((area.y + area.h - Math.min(...ys)) * scale - 0.5)
    for (let row = Math.max(0, y0); row <= Math.min(height - 1, y1); row++)
      for (let col = Math.max(0, x0); col <= Math.min(width - 1, x1); col++)
        grey[row * width + col] = value
  }

  for (const line of content.split('\n')) {
    if (line.startsWith('BT ')) continue
    const operands: number[] = []
    for (const token of line.split(' ').filter(Boolean)) {
      const value = Number(token)
      if (!Number.isNaN(value)) {
        operands.push(value)
        continue
      }
      const args = operands.splice(0)
      switch (token) {
        case 'cm':
          ctm = args as Matrix
          break
        case 'rg':
          fill = Math.round(255 * args[0])
          break
        case 'RG':
          strokeGrey = Math.round(255 * args[0])
          break
        case 'w':
          lineWidth = args[0]
          break
        case 're':
          path.push(args)
          break
        case 'f':
          for (const [x, y, w, h] of path) paint(x, y, w, h, fill)
          path = []
          break
        case 'S':
          for (const [x, y, w, h] of path) {
            const half = lineWidth / 2
            paint(x - half, y - half, w + lineWidth, lineWidth, strokeGrey)
            paint(x - half, y + h - half, w + lineWidth, lineWidth, strokeGrey)
            paint(x - half, y - half, lineWidth, h + lineWidth, strokeGrey)
            paint(x + w - half, y - half, lineWidth, h + lineWidth, strokeGrey)
          }
          path = []
          break
        default:
          break // q, Q and anything else leave the picture alone
      }
    }
  }
  return { width, height, grey }
}

export function toRgba({ grey }: GreyImage): Uint8ClampedArray {
  const rgba = new Uint8ClampedArray(grey.length * 4)
  grey.forEach((v, i) => {
    rgba[4 * i] = rgba[4 * i + 1] = rgba[4 * i + 2] = v
    rgba[4 * i + 3] = 255
  })
  return rgba
}
