// Which edges of a check on the server can get the restoration preview: those whose region crop
// the inspector uploaded and whose blur kernel was measured. The preview is made on this screen
// from that crop, with the kernel and noise the device measured — the same request the device
// makes from the crop it kept (restorationRequestOf).
import type { Attachment } from '@/api/attachments'
import type { CheckDetail } from '@/api/fleet'
import { nearestToMedian } from '@/components/check/logic/regionRules'
import type {
  RestorationKernel,
  RestorationSource,
} from '@/components/check/logic/restorationSource'

export interface RestorableEdge {
  measurementId: string
  /** 1-based, as the check's table of edges numbers it. */
  number: number
  orientation: 'vertical' | 'horizontal'
  mtf50CyPx: number
  kernel: RestorationKernel
  /** The uploaded crop of exactly the measured region. */
  crop: Attachment
}

export type UploadedRestoration =
  /** No region crop on the server: the preview exists only on the inspector's device. */
  | { kind: 'none' }
  | { kind: 'unavailable'; reason: string }
  | { kind: 'edges'; edges: RestorableEdge[]; representative: RestorableEdge }

export const NO_KERNEL_REASON =
  'Region crops of this check were uploaded, but none of their edges has a measured blur kernel to restore with.'

/** The measured kernel when it has a usable size (a made-up size would restore nothing real). */
function kernelOf(m: CheckDetail['measurements'][number]): RestorationKernel | null {
  const psf = m.psf
  if (!psf) return null
  const size = psf.model === 'gaussian' ? psf.sigmaPx : psf.radiusPx
  if (size === null || !Number.isFinite(size) || size <= 0) return null
  return { psf: { model: psf.model, sigmaPx: psf.sigmaPx, radiusPx: psf.radiusPx }, noise: m.noise }
}

/**
 * The edge whose MTF50 is nearest the check's median, first on ties: the rule the device uses to
 * pick the region it restores. Without a stored median, the median of the given edges.
 */
export function representativeEdge(
  edges: readonly RestorableEdge[],
  medianMtf50CyPx: number | null,
): RestorableEdge | null {
  return nearestToMedian(edges, (e) => e.mtf50CyPx, medianMtf50CyPx)
}

export function uploadedRestoration(
  check: CheckDetail,
  attachments: readonly Attachment[],
): UploadedRestoration {
  const crops = attachments.filter((a) => a.kind === 'roi' && a.checkId === check.id)
  if (!crops.length) return { kind: 'none' }
  const edges: RestorableEdge[] = []
  check.measurements.forEach((m, i) => {
    // The newest upload of the region wins (the list comes oldest first).
    const crop = crops.findLast(
      (a) => a.measurementId === m.id && a.width === m.roi.w && a.height === m.roi.h,
    )
    const kernel = kernelOf(m)
    if (!crop || !kernel) return
    edges.push({
      measurementId: m.id,
      number: i + 1,
      orientation: m.orientation,
      mtf50CyPx: m.mtf50CyPx,
      kernel,
      crop,
    })
  })
  const representative = representativeEdge(edges, check.medianMtf50CyPx)
  if (!representative) return { kind: 'unavailable', reason: NO_KERNEL_REASON }
  return { kind: 'edges', edges, representative }
}

/** The pixels of one edge for useRestoration: its crop, fetched once when first restored. */
export function uploadedSourceOf(
  edge: RestorableEdge,
  fetchCrop: (attachmentId: string) => Promise<Blob>,
): RestorationSource {
  return {
    available: true,
    from: 'upload',
    image: () => fetchCrop(edge.crop.id),
    measurement: edge.kernel,
    roi: { x: 0, y: 0, w: edge.crop.width, h: edge.crop.height },
  }
}
