// Whether this browser can open the phone camera as a live stream (getUserMedia needs a secure page).
export function liveCameraSupported(): boolean {
  return (
    typeof navigator !== 'undefined' &&
    typeof navigator.mediaDevices?.getUserMedia === 'function' &&
    typeof window !== 'undefined' &&
    window.isSecureContext
  )
}
