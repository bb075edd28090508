// Hands a file made on the device to the browser: a download, or a new tab to print from.
// Works offline: nothing leaves the device.

export function downloadBlob(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob)
  const a = document.createElement('a')
  a.href = url
  a.download = fileName
  a.rel = 'noopener'
  document.body.appendChild(a)
  a.click()
  a.remove()
  // Give the browser time to start reading the file before the URL goes away.
  setTimeout(() => URL.revokeObjectURL(url), 60_000)
}

/** Opens the file in a new tab (the browser's PDF viewer prints it); false if a pop-up blocker said no. */
export function openBlob(blob: Blob): boolean {
  const url = URL.createObjectURL(blob)
  const win = window.open(url, '_blank')
  setTimeout(() => URL.revokeObjectURL(url), 60_000)
  return win !== null
}
