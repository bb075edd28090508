// Photos on work orders: only PNG and JPEG, recognised by their bytes (not by the name or the
// type the browser claims), with their size read from the header; stored as files under the
// data folder, one folder per order.
import { createHash, randomUUID } from 'node:crypto'
import { mkdir, readFile, rm, writeFile } from 'node:fs/promises'
import { dirname, join, resolve, sep } from 'node:path'
import { WORK_ORDER_ERRORS } from '../../../shared/schemas/workOrders'
import { AppError } from '../../errors'

export const MAX_PHOTO_BYTES = 15 * 1024 * 1024
export const MAX_PHOTO_PIXELS = 100_000_000

export interface ImageInfo {
  mime: 'image/png' | 'image/jpeg'
  width: number
  height: number
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]

function bad(message: string): AppError {
  return new AppError(WORK_ORDER_ERRORS.badPhoto, message, 400)
}

function pngInfo(b: Buffer): ImageInfo {
  // Signature, then the IHDR chunk: length (4), "IHDR", width (4), height (4).
  if (b.length < 33 || b.toString('latin1', 12, 16) !== 'IHDR') throw bad('The PNG file is damaged: it has no image header.')
  return { mime: 'image/png', width: b.readUInt32BE(16), height: b.readUInt32BE(20) }
}

function jpegInfo(b: Buffer): ImageInfo {
  // Walk the marker segments after SOI up to a start-of-frame (SOF0…SOF15 except DHT/JPG/DAC).
  let i = 2
  while (i + 9 < b.length) {
    if (b[i] !== 0xff) throw bad('The JPEG file is damaged: a marker is missing.')
    const marker = b[i + 1]
    if (marker === 0xff) {
      i++
      continue
    }
    if (marker === 0xd8 || marker === 0x01 || (marker >= 0xd0 && marker <= 0xd7)) {
      i += 2
      continue
    }
    const length = b.readUInt16BE(i + 2)
    if (length < 2) throw bad('The JPEG file is damaged: a segment has a bad length.')
    const isSof = marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc
    if (isSof) return { mime: 'image/jpeg', height: b.readUInt16BE(i + 5), width: b.readUInt16BE(i + 7) }
    if (marker === 0xd9 || marker === 0xda) break
    i += 2 + length
  }
  throw bad('The JPEG file is damaged: it has no frame header.')
}

/** What the bytes are: PNG or JPEG with a plausible size, or a 400 saying what is wrong. */
export function sniffImage(bytes: Buffer): ImageInfo {
  if (bytes.length === 0) throw bad('The photo file is empty.')
  let info: ImageInfo
  if (PNG_SIGNATURE.every((v, k) => bytes[k] === v)) info = pngInfo(bytes)
  else if (bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) info = jpegInfo(bytes)
  else throw bad('Only PNG and JPEG photos can be attached.')
  if (info.width < 1 || info.height < 1) throw bad('The photo has no pixels.')
  if (info.width * info.height > MAX_PHOTO_PIXELS)
    throw bad(`The photo is ${info.width} × ${info.height} pixels; at most 100 megapixels can be attached.`)
  return info
}

export interface StoredPhoto {
  id: string
  storageKey: string
  sha256: string
  bytes: number
}

export interface PhotoStore {
  save(orderId: number, info: ImageInfo, bytes: Buffer): Promise<StoredPhoto>
  read(storageKey: string): Promise<Buffer>
  remove(storageKey: string): Promise<void>
}

/** Files under `<dataDir>/uploads/`; keys are relative paths that never leave that folder. */
export function createPhotoStore(dataDir: string): PhotoStore {
  const root = resolve(dataDir, 'uploads')
  const pathOf = (key: string) => {
    const full = resolve(root, key)
    if (!full.startsWith(root + sep)) throw new Error(`storage key ${key} leaves the upload folder`)
    return full
  }
  return {
    async save(orderId, info, bytes) {
      const id = randomUUID()
      const storageKey = join('work-orders', String(orderId), `${id}.${info.mime === 'image/png' ? 'png' : 'jpg'}`)
      const full = pathOf(storageKey)
      await mkdir(dirname(full), { recursive: true })
      await writeFile(full, bytes, { flag: 'wx' })
      return { id, storageKey, sha256: createHash('sha256').update(bytes).digest('hex'), bytes: bytes.length }
    },
    read: (key) => readFile(pathOf(key)),
    async remove(key) {
      await rm(pathOf(key), { force: true })
    },
  }
}
