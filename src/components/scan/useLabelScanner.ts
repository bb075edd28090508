// The phone camera for scanning labels: opens the rear camera (getUserMedia), reads QR codes
// from the video a few times a second, and always lets the camera go again — on stop, on an
// error, and when the component that uses it goes away (closing the sheet, leaving the page).
import { onScopeDispose, ref } from 'vue'
import { liveCameraSupported } from '@/utils/camera'
import { cameraProblemMessage, cameraProblemOf, type CameraProblem } from './cameraErrors'
import { createQrDecoder, type QrDecoder } from './qrDecoder'

export type ScannerState = 'idle' | 'starting' | 'scanning' | 'failed'

/** Pause between two reads of the video, ms (about 6 reads a second leaves the phone cool). */
export const SCAN_INTERVAL_MS = 160

/** Return true to stop scanning (the code was the one wanted). */
export type CodeHandler = (text: string) => boolean

export interface ScannerOptions {
  /** The other way to go on when the camera fails, e.g. "type the target id" (default: asset tag). */
  fallback?: string
}

export function useLabelScanner(options: ScannerOptions = {}) {
  const state = ref<ScannerState>('idle')
  const problem = ref<CameraProblem | null>(null)
  const error = ref<string | null>(null)
  const engine = ref<QrDecoder['engine'] | null>(null)

  let stream: MediaStream | null = null
  let video: HTMLVideoElement | null = null
  let timer: ReturnType<typeof setTimeout> | null = null
  /** Bumped by every start and stop: a late getUserMedia answer for an old session is dropped. */
  let session = 0

  function fail(kind: CameraProblem): void {
    problem.value = kind
    error.value = cameraProblemMessage(kind, options.fallback)
    state.value = 'failed'
  }

  function release(): void {
    if (timer !== null) clearTimeout(timer)
    timer = null
    stream?.getTracks().forEach((t) => t.stop())
    stream = null
    if (video) {
      video.pause()
      video.srcObject = null
    }
    video = null
  }

  /** Lets the camera go. Safe to call at any time, also twice. */
  function stop(): void {
    session++
    release()
    if (state.value !== 'failed') state.value = 'idle'
  }

  async function start(target: HTMLVideoElement, onCode: CodeHandler): Promise<boolean> {
    stop()
    const mine = ++session
    problem.value = null
    error.value = null
    if (!liveCameraSupported()) {
      fail('unsupported')
      return false
    }
    state.value = 'starting'
    let opened: MediaStream
    let decoder: QrDecoder
    try {
      ;[opened, decoder] = await Promise.all([
        navigator.mediaDevices.getUserMedia({
          video: {
            facingMode: { ideal: 'environment' },
            width: { ideal: 1280 },
            height: { ideal: 720 },
          },
          audio: false,
        }),
        createQrDecoder(),
      ])
    } catch (e) {
      if (mine === session) fail(cameraProblemOf(e))
      return false
    }
    if (mine !== session) {
      // Closed while the permission prompt was up: give the camera straight back.
      opened.getTracks().forEach((t) => t.stop())
      return false
    }
    stream = opened
    video = target
    engine.value = decoder.engine
    target.srcObject = opened
    try {
      await target.play()
    } catch (e) {
      if (mine !== session) return false
      release()
      fail(cameraProblemOf(e))
      return false
    }
    if (mine !== session) return false
    state.value = 'scanning'
    let lastText: string | null = null
    const tick = async () => {
      if (mine !== session) return
      let text: string | null = null
      if (target.readyState >= HTMLMediaElement.HAVE_CURRENT_DATA) {
        try {
          text = await decoder.decode(target)
        } catch {
          text = null // one unreadable frame is no reason to stop
        }
      }
      if (mine !== session) return
      // The same wrong code in front of the camera is reported once, not six times a second.
      if (text !== null && text !== lastText) {
        lastText = text
        if (onCode(text)) {
          stop()
          return
        }
      }
      timer = setTimeout(() => void tick(), SCAN_INTERVAL_MS)
    }
    void tick()
    return true
  }

  onScopeDispose(stop)

  return { state, problem, error, engine, start, stop }
}
