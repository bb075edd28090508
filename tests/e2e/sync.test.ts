// A check saved with no network stays on the phone (through a reload), shows on the Sync screen,
// and reaches the server once the network returns — with its region crop, stored and re-measured.
// The check is queued through the app's own outbox module (bundled from src/ and run in the page
// against the app's IndexedDB), exactly as the check screen queues it.
import { randomUUID } from 'node:crypto'
import { decode } from 'image-js'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { toGreyImage } from '../../shared/analysis/image/luminance'
import { measureEdge } from '../../shared/analysis/mtf/measureEdge'
import { encodePngGrey, renderEdgeCodes } from '../fixtures/edges/render'
import { launchBrowser, signIn, waitForServiceWorker, type TestBrowser } from './browser'
import { apiWith } from './api'
import { bundleForPage } from './harness/bundle'

const baseUrl = inject('baseUrl')
let browser: TestBrowser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** A 120 × 120 crop of a slanted edge (Gaussian σ = 1 px, 5°) and the engine's MTF50 of it. */
function regionCrop() {
  const edge = renderEdgeCodes({
    kernel: { type: 'gaussian', sigmaPx: 1 },
    angleDeg: 5,
    widthPx: 120,
    heightPx: 120,
  })
  const png = encodePngGrey(120, 120, edge.codes)
  const raw = decode(png).getRawImage()
  const grey = toGreyImage({
    width: 120,
    height: 120,
    data: raw.data as Uint8Array,
    channels: raw.channels,
    bitDepth: 8,
  })
  const m = measureEdge(grey, { x: 0, y: 0, w: 120, h: 120 })
  return { png, measurement: m }
}

describe('sync', () => {
  it('a check saved offline reaches the server once the network returns', async () => {
    const { page, context } = browser
    await signIn(page, baseUrl, 'inspector@sharpfield.test')
    await page.waitForURL(`${baseUrl}/rounds`)
    await waitForServiceWorker(page)
    const token = await page.evaluate(
      () =>
        (JSON.parse(localStorage.getItem('sharpfield.session') ?? '{}') as { token: string }).token,
    )
    const list = await apiWith<{ items: { id: number; assetTag: string }[] }>(
      token,
      '/api/cameras?limit=1',
    )
    const camera = list.items[0]

    await page.goto(`${baseUrl}/sync`)
    await page.locator('[data-test="sync-pending-count"]').waitFor()
    await context.setOffline(true)
    await page.locator('[data-test="offline-badge"]').waitFor()

    const { png, measurement: m } = regionCrop()
    const checkId = randomUUID()
    const payload = {
      id: checkId,
      cameraId: camera.id,
      capturedAt: new Date(Date.now() - 60_000).toISOString(),
      mode: 'day',
      verdict: 'fail',
      reasons: [
        {
          code: 'sharpness',
          text: `Median MTF50 ${m.mtf50!.toFixed(3)} c/p is below the task minimum.`,
        },
      ],
      medianMtf50CyPx: m.mtf50,
      shareFrame: false,
      measurements: [
        {
          id: randomUUID(),
          roi: { x: 200, y: 150, w: 120, h: 120 },
          orientation: m.orientation,
          angleDeg: m.angleDeg,
          mtf50CyPx: m.mtf50,
          mtfCurve: m.mtf,
          warnings: m.warnings,
        },
      ],
    }
    const outbox = await bundleForPage(
      `export { enqueue, outboxTables } from '@/db/outbox'\nexport { db } from '@/db/database'\n`,
      '__sfOutbox',
    )
    // Save the check's crop and queue the check in one transaction, as the check screen does.
    // The page's CSP forbids eval; this copy of zod must not try its compiled fast path (zod
    // reads the setting, shared by every copy in the page, when a schema is created).
    const jitless =
      'globalThis.__zod_globalConfig = Object.assign(globalThis.__zod_globalConfig ?? {}, { jitless: true });'
    await page.evaluate(`${jitless}\n${outbox}\n;0`)
    await page.evaluate(
      async ({ payload, crop }) => {
        const w = window as unknown as {
          __sfOutbox: {
            db: {
              transaction: (...a: unknown[]) => Promise<void>
              crops: { put(r: unknown): Promise<unknown> }
            }
            enqueue(kind: string, payload: unknown): Promise<unknown>
            outboxTables(): unknown[]
          }
        }
        const { db, enqueue, outboxTables } = w.__sfOutbox
        const blob = new Blob([new Uint8Array(crop)], { type: 'image/png' })
        const measurementId = payload.measurements[0].id
        await db.transaction('rw', outboxTables(), async () => {
          await db.crops.put({
            id: measurementId,
            checkId: payload.id,
            kind: 'roi',
            blob,
            mime: 'image/png',
            width: 120,
            height: 120,
            encoding: 'srgb',
          })
          await enqueue('check.create', payload)
        })
      },
      { payload, crop: Array.from(png) },
    )

    // Still offline, after a reload: the check waits on the device and the screen says so.
    await page.reload()
    await page.locator('[data-test="offline-badge"]').waitFor()
    await expect.poll(() => page.locator('[data-test="sync-pending-count"]').innerText()).toBe('1')
    expect(await page.locator('[data-test="outbox-item"]').innerText()).toContain(camera.assetTag)
    await browser.screenshot('sync-offline-queued')
    const onServerBefore = await apiWith<{ checks: { id: string }[] }>(
      token,
      `/api/cameras/${camera.id}/checks?limit=500`,
    )
    expect(onServerBefore.checks.some((c) => c.id === checkId)).toBe(false)

    // The network returns: the app pushes by itself (online event), then uploads the crop.
    await context.setOffline(false)
    // Other tests may record newer checks on the same camera, so look for this check in its
    // history rather than expecting it to be the camera's latest.
    await expect
      .poll(
        async () =>
          (
            await apiWith<{ checks: { id: string }[] }>(
              token,
              `/api/cameras/${camera.id}/checks?limit=500`,
            )
          ).checks.filter((c) => c.id === checkId).length,
        { timeout: 30_000 },
      )
      .toBe(1)
    await expect
      .poll(() => page.locator('[data-test="sync-pending-count"]').innerText(), { timeout: 30_000 })
      .toBe('0')
    await expect
      .poll(
        async () =>
          (await apiWith<{ items: unknown[] }>(token, `/api/checks/${checkId}/attachments`)).items
            .length,
        {
          timeout: 30_000,
        },
      )
      .toBe(1)
    const files = await apiWith<{ items: { kind: string; width: number; sha256: string }[] }>(
      token,
      `/api/checks/${checkId}/attachments`,
    )
    expect(files.items[0]).toMatchObject({ kind: 'roi', width: 120 })
    expect(await page.locator('[data-test="sync-last"]').innerText()).toContain('just now')
    await browser.screenshot('sync-online-sent')
  })
})
