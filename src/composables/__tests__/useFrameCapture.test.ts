import { afterEach, describe, expect, it, vi } from 'vitest'
import { effectScope } from 'vue'
import { encodePngGrey } from '../../../tests/fixtures/edges/render'
import { useFrameCapture, validateFrameFile } from '../useFrameCapture'

// Taking a frame: every file is checked from its header before anything is decoded.

const png = new Blob([new Uint8Array(encodePngGrey(64, 48, new Uint8Array(64 * 48)))], {
  type: 'image/png',
})

describe('choosing a frame file', () => {
  it('accepts a PNG and keeps its name and header', async () => {
    const frame = await validateFrameFile(png, 'snap.png')
    expect(frame.name).toBe('snap.png')
    expect(frame.header).toMatchObject({ format: 'png', width: 64, height: 48 })
  })

  it('refuses a file over 80 MB from its size alone', async () => {
    const huge = { size: 90 * 1024 * 1024, slice: () => png } as unknown as Blob
    await expect(validateFrameFile(huge)).rejects.toThrow('The file is 90 MB; the limit is 80 MB.')
  })

  it('shows a clear message for a file that is not an image and keeps nothing', async () => {
    const scope = effectScope()
    const capture = scope.run(() => useFrameCapture())!
    expect(await capture.accept(new Blob(['%PDF-1.7 …']), 'report.pdf')).toBeNull()
    expect(capture.error.value).toMatch(/not a PNG or JPEG image/)
    expect(capture.accepted.value).toBeNull()
    expect(await capture.accept(png, 'snap.png')).not.toBeNull()
    expect(capture.error.value).toBeNull()
    expect(capture.accepted.value?.name).toBe('snap.png')
    scope.stop()
  })

  it('says the live preview is unavailable where the browser has no camera API', async () => {
    const scope = effectScope()
    const capture = scope.run(() => useFrameCapture())!
    expect(capture.liveSupported).toBe(false)
    expect(await capture.startLive({} as HTMLVideoElement)).toBe(false)
    expect(capture.error.value).toMatch(/use “Take photo” or “Import file”/)
    scope.stop()
  })
})

describe('the live preview', () => {
  afterEach(() => {
    vi.unstubAllGlobals()
  })

  it('lets the camera go when stopped while the browser was still opening it', async () => {
    // A phone allows one camera stream: a preview closed before its stream arrived (e.g. the code
    // scanner opening) must not keep that stream running.
    const stop = vi.fn()
    let deliver: (s: MediaStream) => void = () => {}
    const getUserMedia = vi.fn(() => new Promise<MediaStream>((resolve) => (deliver = resolve)))
    vi.stubGlobal('navigator', { mediaDevices: { getUserMedia } })
    vi.stubGlobal('window', { isSecureContext: true })
    const scope = effectScope()
    const capture = scope.run(() => useFrameCapture())!
    expect(capture.liveSupported).toBe(true)
    const video = { srcObject: null, play: vi.fn(async () => {}) } as unknown as HTMLVideoElement
    const started = capture.startLive(video)
    capture.stopLive()
    deliver({ getTracks: () => [{ stop }] } as unknown as MediaStream)
    expect(await started).toBe(false)
    expect(stop).toHaveBeenCalledTimes(1)
    expect(capture.stream.value).toBeNull()
    expect(video.srcObject).toBeNull()
    scope.stop()
  })
})
