// A supervisor opens, in the fleet, a check whose region crop the inspector uploaded: the card
// offers the restoration preview made from that crop with the measured kernel, labelled
// illustrative and not evidential, with the detail that is gone for good. A check without an
// uploaded crop still says the preview lives on the device that made it. Real Chromium, the
// built app, the real server and MariaDB; the check and its crop are sent over the API as the
// device's sync sends them.
import { randomUUID } from 'node:crypto'
import { decode } from 'image-js'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { toGreyImage } from '../../shared/analysis/image/luminance'
import { measureEdge } from '../../shared/analysis/mtf/measureEdge'
import { measurementPayload } from '../../shared/schemas/measurementPayload'
import { checkPayload } from '../fixtures/checkPayload'
import { encodePngGrey, renderEdgeCodes } from '../fixtures/edges/render'
import { apiWith, tokenOf } from './api'
import { launchBrowser, signIn, type TestBrowser } from './browser'

const baseUrl = inject('baseUrl')
const ROI = 120
let browser: TestBrowser

beforeAll(async () => {
  browser = await launchBrowser({ width: 1280, height: 900 })
})
afterAll(async () => {
  await browser?.close()
})

/** A region crop of a slanted edge blurred by a Gaussian of σ = 1.5 px, and the engine's reading. */
function regionCrop() {
  const edge = renderEdgeCodes({
    kernel: { type: 'gaussian', sigmaPx: 1.5 },
    angleDeg: 5,
    widthPx: ROI,
    heightPx: ROI,
  })
  const png = encodePngGrey(ROI, ROI, edge.codes)
  const raw = decode(png).getRawImage()
  const grey = toGreyImage({
    width: ROI,
    height: ROI,
    data: raw.data as Uint8Array,
    channels: raw.channels,
    bitDepth: 8,
  })
  return { png, codes: edge.codes, m: measureEdge(grey, { x: 0, y: 0, w: ROI, h: ROI }) }
}

/** Pushes a check (as the inspector's device would) `hoursBefore` the camera's last check. */
async function pushCheck(inspector: string, camera: { id: number; lastCheckAt: string }) {
  const { m, ...crop } = regionCrop()
  const hoursBefore = 1 + Math.random()
  const payload = checkPayload(camera.id, {
    capturedAt: new Date(Date.parse(camera.lastCheckAt) - hoursBefore * 3600_000).toISOString(),
    verdict: 'fail',
    reasons: [
      { code: 'sharpness', text: `Median MTF50 ${m.mtf50!.toFixed(3)} c/p is below the minimum.` },
    ],
    medianMtf50CyPx: m.mtf50,
    measurements: [
      { ...measurementPayload(randomUUID(), m), roi: { x: 300, y: 200, w: ROI, h: ROI } },
    ],
  })
  const pushed = await apiWith<{ results: { status: string }[] }>(inspector, '/api/sync/push', {
    deviceId: `e2e-restore-${randomUUID().slice(0, 8)}`,
    ops: [{ id: randomUUID(), kind: 'check.create', payload }],
  })
  expect(pushed.results[0].status).toBe('applied')
  return { payload, crop, m }
}

async function uploadCrop(
  inspector: string,
  checkId: string,
  measurementId: string,
  png: Uint8Array,
) {
  const form = new FormData()
  form.set('kind', 'roi')
  form.set('measurementId', measurementId)
  form.set('encoding', 'srgb')
  form.set('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'crop.png')
  const res = await fetch(`${baseUrl}/api/checks/${checkId}/attachments`, {
    method: 'POST',
    headers: { Authorization: `Bearer ${inspector}` },
    body: form,
  })
  expect(res.status).toBe(201)
}

/** Opens a camera in the fleet and the given check of its history. */
async function openCheck(page: Page, supervisor: string, cameraId: number, checkId: string) {
  await page.goto(`${baseUrl}/fleet/cameras/${cameraId}`)
  const rows = page.locator('[data-test="history-row"]')
  await expect.poll(() => rows.count()).toBeGreaterThan(1)
  const history = await apiWith<{ checks: { id: string }[] }>(
    supervisor,
    `/api/fleet/cameras/${cameraId}/history`,
  )
  const at = history.checks.findIndex((c) => c.id === checkId)
  expect(at).toBeGreaterThanOrEqual(0)
  await rows.nth(at).click()
  await page.locator('[data-test="check-detail"]').waitFor()
}

/** The red channel of a canvas, row by row. */
function canvasGrey(page: Page, label: string): Promise<number[]> {
  return page.evaluate((label) => {
    const c = document.querySelector<HTMLCanvasElement>(`canvas[aria-label="${label}"]`)!
    const d = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data
    return Array.from({ length: d.length / 4 }, (_, i) => d[4 * i])
  }, label)
}

/** The steepest step between neighbours along each row, averaged over the rows (codes). */
function steepestStep(grey: number[]): number {
  let sum = 0
  for (let y = 0; y < ROI; y++) {
    let most = 0
    for (let x = 1; x < ROI; x++)
      most = Math.max(most, Math.abs(grey[y * ROI + x] - grey[y * ROI + x - 1]))
    sum += most
  }
  return sum / ROI
}

describe('a check with an uploaded region crop, seen in the fleet', () => {
  it('offers the restoration preview from that crop, labelled illustrative', async () => {
    const inspector = await tokenOf('inspector@sharpfield.test')
    const supervisor = await tokenOf('supervisor@sharpfield.test')
    const { items } = await apiWith<{ items: { id: number; lastCheckAt: string | null }[] }>(
      supervisor,
      '/api/cameras?limit=50',
    )
    const camera = items.find((c) => c.lastCheckAt !== null) as { id: number; lastCheckAt: string }
    const withCrop = await pushCheck(inspector, camera)
    const measurementId = withCrop.payload.measurements[0].id
    await uploadCrop(inspector, withCrop.payload.id, measurementId, withCrop.crop.png)
    const withoutCrop = await pushCheck(inspector, camera)

    const { page } = browser
    const violations: string[] = []
    page.on('console', (msg) => {
      if (/Content Security Policy|Refused to/i.test(msg.text())) violations.push(msg.text())
    })
    await signIn(page, baseUrl, 'supervisor@sharpfield.test')
    await page.waitForURL(`${baseUrl}/fleet`)

    // Without an uploaded crop: today's note, no preview.
    await openCheck(page, supervisor, camera.id, withoutCrop.payload.id)
    const elsewhere = page.locator('[data-test="restoration-elsewhere"]')
    await expect.poll(() => elsewhere.innerText()).toContain('illustrative, not evidential')
    expect(await page.locator('[data-test="restoration"]').count()).toBe(0)

    // With one: the preview, its label, and the crop fetched privately from the server.
    await openCheck(page, supervisor, camera.id, withCrop.payload.id)
    const card = page.locator('[data-test="restoration"]')
    await card.waitFor()
    expect(await card.locator('[data-test="restoration-label"]').innerText()).toContain(
      'Illustrative — not evidential',
    )
    expect(await page.locator('[data-test="restoration-from-upload"]').innerText()).toContain(
      'edge 1',
    )
    const [content] = await Promise.all([
      page.waitForResponse((r) => /\/api\/attachments\/[^/]+\/content$/.test(r.url())),
      card.locator('[data-test="restore-button"]').click(),
    ])
    expect(content.status()).toBe(200)
    expect(content.headers()['content-type']).toBe('image/png')
    expect(content.headers()['cache-control']).toMatch(/^private\b/)

    const lost = card.locator('[data-test="lost-frequencies"] li')
    await expect.poll(() => lost.count()).toBeGreaterThan(0)
    // A Gaussian of σ = 1.5 px passes exp(−2π²σ²f²) ≈ 1.5e-5 at Nyquist (0.5 c/p) [calc]: far
    // below the preview's noise floor of 1e-3, so the finest detail is named as gone.
    expect((await lost.allInnerTexts()).join(' ')).toContain('no restoration brings it back')
    expect(await card.locator('.restore__stamp').innerText()).toBe('ILLUSTRATIVE')

    // "As recorded" is the uploaded crop itself (8-bit sRGB codes, ±1 for the round trip through
    // linear light); the restored region has steeper edges than the recorded one.
    const before = await canvasGrey(page, 'Region as recorded')
    const after = await canvasGrey(page, 'Region restored, illustrative')
    expect(before).toHaveLength(ROI * ROI)
    expect(
      Math.max(...before.map((v, i) => Math.abs(v - withCrop.crop.codes[i]))),
    ).toBeLessThanOrEqual(1)
    expect(steepestStep(after)).toBeGreaterThan(1.2 * steepestStep(before))
    await page
      .locator('.check-restoration')
      .evaluate((el) => el.scrollIntoView({ block: 'center' }))
    await browser.screenshot('fleet-restoration-preview')
    // The worker, the fetched crop and the canvases all run under the app's content policy.
    expect(violations).toEqual([])
  })
})
