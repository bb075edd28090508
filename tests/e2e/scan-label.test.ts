// Scanning a camera's QR label with the phone camera, offline. Chromium's fake camera plays a
// y4m video of a printed label made from the app's own label format; the inspector taps "Scan
// label" on the rounds screen and lands on that camera. Labels of other things, labels of
// cameras the device does not know and a refused camera each get their message, and the camera
// is let go every time. Screenshots: test-results/e2e/scan-*.png.
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { encodeCameraLabel } from '../../shared/target/cameraLabel'
import { launchBrowser, signIn, waitForServiceWorker, type TestBrowser } from './browser'
import { fakeCameraShowing } from './harness/fakeCamera'

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

/**
 * Starts Chromium with a fake camera showing the QR code of `code`, signs the inspector in
 * online (the camera list reaches the device), then goes offline.
 */
async function inspectorOffline(code: string, args: string[]): Promise<TestBrowser> {
  const video = join(videoDir, `label-${++videos}.y4m`)
  const browser = await launchBrowser(undefined, {
    args: [...fakeCameraShowing(video, code), ...args],
  })
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
})
