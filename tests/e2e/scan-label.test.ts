// Scanning a camera's QR label with the phone camera, offline. Chromium's fake camera plays a
// y4m video of a printed label made from the app's own label format; the inspector taps "Scan
// label" on the rounds screen and lands on that camera. Labels of other things, labels of
// cameras the device does not know and a refused camera each get their message, and the camera
// is let go every time. A label sheet downloaded from Setup is drawn from its PDF and scanned
// back to its camera, and the Frame step of a check takes a target's code from the camera.
// Screenshots: test-results/e2e/scan-*.png.
import { mkdtempSync, readFileSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { BrowserContext, Page } from 'playwright-core'
import type { RectMm } from '../../shared/target/geometry'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { encodeCameraLabel } from '../../shared/target/cameraLabel'
import { labelGrid } from '../../shared/target/labelSheet'
import { encodeTargetPayload } from '../../shared/target/payload'
import { rasteriseRects, toRgba } from '../../src/components/labels/__tests__/rasterise'
import { decodeQrPixels } from '../../src/components/scan/qrPixels'
import { PT_PER_MM } from '../../src/services/pdf/format'
import { parsePdf } from '../../src/services/__tests__/pdfParse'
import { apiAs } from './api'
import { launchBrowser, signIn, waitForServiceWorker, type TestBrowser } from './browser'
import { fakeCameraShowing, writeGreyY4m } from './harness/fakeCamera'

const baseUrl = inject('baseUrl')
const videoDir = mkdtempSync(join(tmpdir(), 'sf-fake-camera-'))
const open: TestBrowser[] = []
afterAll(async () => {
  for (const b of open) await b.close()
  rmSync(videoDir, { recursive: true, force: true })
})

/** A demo camera (server/db/demo/fleet.ts) far down the list, so the first row is no match. */
const DEMO_TAG = 'FFY-003'
const GRANT = '--use-fake-ui-for-media-stream'

/** Keeps every stream the page opens, so the test can see whether the app let it go. */
async function trackStreams(context: BrowserContext): Promise<void> {
  await context.addInitScript(() => {
    const w = window as unknown as { sfStreams: MediaStream[] }
    w.sfStreams = []
    const devices = navigator.mediaDevices
    if (!devices) return
    const original = devices.getUserMedia.bind(devices)
    devices.getUserMedia = async (constraints) => {
      const stream = await original(constraints)
      w.sfStreams.push(stream)
      return stream
    }
  })
}

/** [streams opened, live tracks left]. */
function streamState(page: Page): Promise<[number, number]> {
  return page.evaluate(() => {
    const streams = (window as unknown as { sfStreams: MediaStream[] }).sfStreams
    const live = streams.flatMap((s) => s.getTracks()).filter((t) => t.readyState === 'live')
    return [streams.length, live.length] as [number, number]
  })
}

let videos = 0
const ADMIN = 'admin@sharpfield.test'

/**
 * The label in `cell` (mm, from the page's top-left) of a PDF page, drawn from the PDF's own
 * rectangles at 5 px per mm and set like a photo of paper (dark 30, white 225) in a grey scene.
 */
function labelPhoto(content: string, pageHeightMm: number, cell: RectMm): LumaPicture {
  const area = {
    x: cell.x * PT_PER_MM,
    y: (pageHeightMm - cell.y - cell.h) * PT_PER_MM,
    w: cell.w * PT_PER_MM,
    h: cell.h * PT_PER_MM,
  }
  const label = rasteriseRects(content, area, 5 * 25.4)
  const [width, height] = [640, 480]
  const luma = new Uint8Array(width * height).fill(110)
  const x0 = (width - label.width) >> 1
  const y0 = (height - label.height) >> 1
  for (let y = 0; y < label.height; y++)
    for (let x = 0; x < label.width; x++)
      luma[(y0 + y) * width + x0 + x] =
        30 + Math.round((label.grey[y * label.width + x] * 195) / 255)
  return { luma, width, height }
}

/** Clicks Download in the open label panel and returns the PDF the browser saved. */
async function downloadLabels(page: Page): Promise<{ name: string; bytes: Uint8Array }> {
  const [download] = await Promise.all([
    page.waitForEvent('download'),
    page.locator('[data-test="labels-download"]').click(),
  ])
  return { name: download.suggestedFilename(), bytes: readFileSync(await download.path()) }
}

/** A 640 × 480 grey picture to show the fake camera, as 8-bit luma. */
interface LumaPicture {
  luma: Uint8Array
  width: number
  height: number
}

/**
 * Starts Chromium with a fake camera showing the QR code of `code` (or a picture), signs the
 * inspector in online (the camera list reaches the device), then goes offline.
 */
async function inspectorOffline(code: string | LumaPicture, args: string[]): Promise<TestBrowser> {
  const video = join(videoDir, `label-${++videos}.y4m`)
  let camera: string[]
  if (typeof code === 'string') camera = fakeCameraShowing(video, code)
  else {
    writeGreyY4m(video, code.luma, code.width, code.height)
    camera = ['--use-fake-device-for-media-stream', `--use-file-for-fake-video-capture=${video}`]
  }
  const browser = await launchBrowser(undefined, { args: [...camera, ...args] })
  open.push(browser)
  await trackStreams(browser.context)
  const { page, context } = browser
  await signIn(page, baseUrl, 'inspector@sharpfield.test')
  await page.waitForURL(`${baseUrl}/rounds`)
  await waitForServiceWorker(page)
  await expect.poll(() => page.locator('[data-test="camera-row"]').count()).toBeGreaterThan(0)
  await context.setOffline(true)
  await page.goto(`${baseUrl}/rounds`)
  await page.locator('[data-test="offline-badge"]').waitFor()
  return browser
}

describe('scanning a camera label', () => {
  it('selects the labelled camera from the live camera, offline, and lets the camera go', async () => {
    const browser = await inspectorOffline(encodeCameraLabel({ assetTag: DEMO_TAG }), [GRANT])
    const { page } = browser
    const uncaught: string[] = []
    page.on('pageerror', (e) => uncaught.push(e.message))
    await page.locator('[data-test="scan-label"]').click()
    await page.locator('[data-test="label-scanner"]').waitFor()
    await browser.screenshot('scan-1-scanning')
    await page.waitForURL(/\/cameras\/\d+$/, { timeout: 30_000 })
    expect(await page.locator('[data-test="camera-asset-tag"]').innerText()).toBe(DEMO_TAG)
    await browser.screenshot('scan-2-selected')
    const [opened, live] = await streamState(page)
    expect(opened).toBe(1)
    expect(live).toBe(0)
    expect(uncaught).toEqual([])
  })

  it('names a labelled camera this device does not have, and frees the camera on close', async () => {
    const browser = await inspectorOffline(encodeCameraLabel({ assetTag: 'ZZZ-999' }), [GRANT])
    const { page } = browser
    await page.locator('[data-test="scan-label"]').click()
    const problem = page.locator('[data-test="scan-problem"]')
    await problem.waitFor({ timeout: 30_000 })
    expect(await problem.innerText()).toMatch(
      /Camera ZZZ-999 is not among the \d+ cameras saved on this device/,
    )
    expect(new URL(page.url()).pathname).toBe('/rounds')
    expect((await streamState(page))[1]).toBe(1)
    await browser.screenshot('scan-3-unknown-camera')
    await page.locator('[data-test="scan-close"]').click()
    await expect.poll(() => streamState(page)).toEqual([1, 0])
  })

  it('says a code that is not a Sharpfield label is not one', async () => {
    const browser = await inspectorOffline('https://example.test/car-park/level-2', [GRANT])
    const { page } = browser
    // Through a camera page and back, so the browser's Forward button stays inside the app.
    await page.locator('[data-test="camera-row"]').first().click()
    await page.waitForURL(/\/cameras\/\d+$/)
    await page.goBack()
    await page.waitForURL(`${baseUrl}/rounds`)
    await page.locator('[data-test="scan-label"]').click()
    const problem = page.locator('[data-test="scan-problem"]')
    await problem.waitFor({ timeout: 30_000 })
    expect(await problem.innerText()).toMatch(/not a Sharpfield camera label/)
    expect((await streamState(page))[1]).toBe(1)
    await browser.screenshot('scan-4-foreign-code')
    // Leaving the page while the scanner is open lets the camera go too.
    await page.goForward()
    await page.waitForURL(/\/cameras\/\d+$/)
    await expect.poll(() => streamState(page)).toEqual([1, 0])
  })

  it('explains a refused camera permission and offers another try', async () => {
    const browser = await inspectorOffline(encodeCameraLabel({ assetTag: DEMO_TAG }), [
      '--deny-permission-prompts',
    ])
    const { page } = browser
    await page.locator('[data-test="scan-label"]').click()
    const error = page.locator('[data-test="scan-error"]')
    await error.waitFor({ timeout: 30_000 })
    expect(await error.innerText()).toMatch(/Camera access was refused/)
    await page.locator('[data-test="scan-retry"]').waitFor()
    await browser.screenshot('scan-5-refused')
    expect(new URL(page.url()).pathname).toBe('/rounds')
  })

  it('prints labels from Setup and from the camera page, and a printed label scans back to its camera', async () => {
    const desk = await launchBrowser()
    open.push(desk)
    const { page } = desk
    await signIn(page, baseUrl, ADMIN)
    await page.waitForURL(`${baseUrl}/setup`)
    await page.goto(`${baseUrl}/setup?tab=cameras`)
    await page.locator('[data-test="setup-cameras"] .van-search input').fill('FFY')
    await expect
      .poll(() => page.locator('[data-test="setup-camera-row"]').allInnerTexts())
      .toSatisfy((rows: string[]) => rows.length > 0 && rows.every((r) => r.includes('FFY-')))
    const inService = await apiAs<{ items: { id: number; assetTag: string }[]; total: number }>(
      ADMIN,
      '/api/fleet/cameras?q=FFY&limit=200&sort=assetTag',
    )
    const n = inService.total
    const pages = Math.ceil(n / 9)
    expect(n).toBeGreaterThan(9)

    await page.locator('[data-test="setup-camera-labels"]').click()
    await page.locator('[data-test="labels-paper-a4"]').click()
    await expect
      .poll(() => page.locator('[data-test="labels-summary"]').innerText())
      .toBe(`${n} labels on ${pages} A4 pages, 9 to a page.`)
    await desk.screenshot('scan-6-label-sheet')
    const sheet = await downloadLabels(page)
    expect(sheet.name).toBe(`sharpfield-labels-${n}-A4.pdf`)
    const pdf = parsePdf(sheet.bytes)
    expect(pdf.pages).toHaveLength(pages)
    const printed = pdf.pages.flatMap((p) =>
      [...p.content.matchAll(/\((FFY-\d{3})\) Tj/g)].map((m) => m[1]),
    )
    expect(printed).toEqual(inService.items.map((c) => c.assetTag))

    // The label of DEMO_TAG, drawn from the downloaded PDF, reads back to its label text.
    const index = printed.indexOf(DEMO_TAG)
    const photo = labelPhoto(
      pdf.pages[Math.floor(index / 9)].content,
      297,
      labelGrid('A4').cells[index % 9],
    )
    const rgba = toRgba({ ...photo, grey: Uint8ClampedArray.from(photo.luma) })
    expect(decodeQrPixels(rgba, photo.width, photo.height)).toBe(
      encodeCameraLabel({ assetTag: DEMO_TAG }),
    )

    // One camera's label from its page, on US Letter.
    const id = inService.items[index].id
    await page.goto(`${baseUrl}/fleet/cameras/${id}`)
    await page.locator('[data-test="camera-label-pdf"]').click()
    await page.locator('[data-test="labels-paper-letter"]').click()
    await expect
      .poll(() => page.locator('[data-test="labels-summary"]').innerText())
      .toBe('One label on one US Letter page.')
    await desk.screenshot('scan-7-one-label')
    const one = await downloadLabels(page)
    expect(one.name).toBe(`sharpfield-label-${DEMO_TAG}-Letter.pdf`)
    const [letter] = parsePdf(one.bytes).pages
    // Letter = 612 × 792 pt [std: 8.5 × 11 in].
    expect(letter.mediaBox.slice(2).map((v) => Math.round(v))).toEqual([612, 792])
    expect(letter.content).toContain(`(${DEMO_TAG}) Tj`)

    // The printed label in front of an inspector's phone opens its camera.
    const phone = await inspectorOffline(photo, [GRANT])
    await phone.page.locator('[data-test="scan-label"]').click()
    await phone.page.waitForURL(/\/cameras\/\d+$/, { timeout: 30_000 })
    expect(await phone.page.locator('[data-test="camera-asset-tag"]').innerText()).toBe(DEMO_TAG)
  })

  it('takes a target’s code in the Frame step of a check, closing the live preview first, and lets the camera go', async () => {
    const target = { id: 'SFT-7K2M9Q', widthMm: 420, heightMm: 594 }
    const browser = await inspectorOffline(encodeTargetPayload(target), [GRANT])
    const { page } = browser
    const uncaught: string[] = []
    page.on('pageerror', (e) => uncaught.push(e.message))
    await page.locator('[data-test="camera-row"]').first().click()
    await page.waitForURL(/\/cameras\/\d+$/)
    await page.locator('[data-test="start-check"]').click()
    await page.getByRole('button', { name: "I'm in a safe position" }).click()
    await page.waitForURL(/\/cameras\/\d+\/check$/)
    // A running live preview gives the camera up when the scanner opens (phones allow one stream).
    await page.locator('[data-test="live-preview"]').click()
    const preview = page.getByLabel('Live camera preview')
    await preview.waitFor()
    await page.locator('[data-test="scan-target"]').click()
    await preview.waitFor({ state: 'detached' })
    await page.locator('[data-test="target-scanner"]').waitFor()
    const read = page.locator('[data-test="target-scanned"]')
    await read.waitFor({ timeout: 30_000 })
    expect(await read.innerText()).toBe('Read target SFT-7K2M9Q, printed 420 × 594 mm.')
    expect(await page.getByLabel('Target id').inputValue()).toBe('SFT-7K2M9Q')
    expect(await page.locator('[data-test="target-width"] input').inputValue()).toBe('420')
    // Two streams were opened (the preview's and the scanner's); neither is still running.
    await expect.poll(() => streamState(page)).toEqual([2, 0])
    await browser.screenshot('scan-8-target-read')
    expect(uncaught).toEqual([])
  })
})
