// The field check with the network off: an inspector opens a due camera, imports a frame of a
// blurred target, adjusts a region, gets a verdict, saves, reloads, sees the saved check's
// restoration preview again and finds the check in the camera's history — all from the device.
// Screenshots of each step: test-results/e2e/check-*.png.
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { BLURRED_TARGET } from '../fixtures/frames/render'
import { launchBrowser, signIn, waitForServiceWorker, type TestBrowser } from './browser'
import { ROOT } from './harness/root'

const baseUrl = inject('baseUrl')
const FRAME = join(ROOT, 'tests', 'fixtures', 'frames', BLURRED_TARGET.file)

let browser: TestBrowser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('a check made offline', () => {
  it('finds the edges, takes an adjusted region, fails the blurred camera, and survives a reload', async () => {
    const { page, context } = browser
    const uncaught: string[] = []
    page.on('pageerror', (e) => uncaught.push(e.message))
    await signIn(page, baseUrl, 'inspector@sharpfield.test')
    await page.waitForURL(`${baseUrl}/rounds`)
    await waitForServiceWorker(page)
    // The camera list reaches the device while online.
    await expect.poll(() => page.locator('[data-test="camera-row"]').count()).toBeGreaterThan(0)

    await context.setOffline(true)
    await page.goto(`${baseUrl}/rounds`)
    await page.locator('[data-test="offline-badge"]').waitFor()
    const row = page.locator('[data-test="camera-row"]').first()
    const assetTag = (await row.locator('.camera-row__tag').innerText()).trim()
    await row.click()
    await page.waitForURL(/\/cameras\/\d+$/)
    const cameraPath = new URL(page.url()).pathname
    await browser.screenshot('check-1-camera')

    // Safety first, then the check.
    await page.locator('[data-test="start-check"]').click()
    await page.getByRole('button', { name: "I'm in a safe position" }).click()
    await page.waitForURL(/\/cameras\/\d+\/check$/)
    expect(await page.locator('[data-test="check-camera"]').innerText()).toBe(assetTag)
    await browser.screenshot('check-2-frame')

    await page.locator('[data-test="import-file"]').setInputFiles(FRAME)
    await expect
      .poll(() => page.locator('[data-test="region"]').count(), { timeout: 60_000 })
      .toBeGreaterThanOrEqual(8)
    await expect
      .poll(() => page.locator('[data-test="region-mtf50"]').count(), { timeout: 60_000 })
      .toBeGreaterThanOrEqual(8)
    await browser.screenshot('check-3-regions')

    // Every found edge reads close to the analytic MTF50 of the blur: 0.187391 / σ.
    const first = page.locator('[data-test="region-card"]').first()
    const mtf = Number(
      (await first.locator('[data-test="region-mtf50"]').innerText()).match(/MTF50 ([\d.]+)/)![1],
    )
    expect(
      Math.abs(mtf - BLURRED_TARGET.expectedMtf50CyPx) / BLURRED_TARGET.expectedMtf50CyPx,
    ).toBeLessThan(0.03)

    // Zoom in on region 1 (mouse wheel) until its corner handles show, then drag the
    // south-east corner up and left by 20 × 12 screen px.
    const sizeBefore = await first.locator('.region__size').innerText()
    const outline = (await page
      .locator('[data-test="region"][data-region="1"] .reg__box')
      .boundingBox())!
    await page.mouse.move(outline.x + outline.width / 2, outline.y + outline.height / 2)
    await page.mouse.wheel(0, -600)
    const handle = page.locator('[data-test="region"][data-region="1"] [data-corner="se"]')
    const box = (await handle.boundingBox())!
    const [x, y] = [box.x + box.width / 2, box.y + box.height / 2]
    await page.mouse.move(x, y)
    await page.mouse.down()
    await page.mouse.move(x - 10, y - 6, { steps: 4 })
    await page.mouse.move(x - 20, y - 12, { steps: 4 })
    await page.mouse.up()
    await expect.poll(() => first.locator('.region__size').innerText()).not.toBe(sizeBefore)
    await expect.poll(() => first.locator('.region__status').innerText()).toContain('Used')
    await browser.screenshot('check-4-region-adjusted')

    await page.locator('[data-test="see-result"]').click()
    await page.locator('[data-test="verdict-card"]').waitFor()
    expect(await page.locator('[data-test="verdict-word"]').innerText()).toBe('Fail')
    const reasons = await page.locator('[data-test="verdict-reason"]').allInnerTexts()
    expect(reasons.join(' ')).toMatch(/Sharpness 0\.07\d c\/p \(median MTF50 of \d+ edges\)/)
    await page.locator('[data-test="mtf-chart"] canvas').waitFor()
    expect(await page.locator('[data-test="kernel-model"]').innerText()).toMatch(
      /Gaussian, σ = 2\.[45]\d px/,
    )
    await browser.screenshot('check-5-result', { fullPage: true })

    await page.locator('[data-test="restore-button"]').click()
    await page.locator('[data-test="lost-frequencies"]').waitFor({ timeout: 60_000 })
    expect(await page.locator('[data-test="restoration-label"]').innerText()).toContain(
      'Illustrative — not evidential',
    )
    await page.locator('[data-test="restoration"]').scrollIntoViewIfNeeded()
    await browser.screenshot('check-6-restoration')
    const lostWhenChecked = await page.locator('[data-test="lost-frequencies"] li').allInnerTexts()
    expect(lostWhenChecked.length).toBeGreaterThan(0)

    await page.locator('[data-test="save-check"]').click()
    await page.waitForURL(/\/checks\/[0-9a-f-]{36}$/)
    const checkId = new URL(page.url()).pathname.split('/').pop()!
    await page.locator('[data-test="verdict-word"]').waitFor()
    await browser.screenshot('check-7-saved')

    // Still offline: a reload comes from the service worker and the check from IndexedDB.
    await page.reload()
    await page.locator('[data-test="verdict-word"]').waitFor()
    expect(await page.locator('[data-test="verdict-word"]').innerText()).toBe('Fail')
    // The saved check offers the same restoration preview, made from the region kept here.
    await page.locator('[data-test="restore-button"]').click()
    await page.locator('[data-test="lost-frequencies"]').waitFor({ timeout: 60_000 })
    expect(await page.locator('[data-test="restoration-label"]').innerText()).toContain(
      'Illustrative — not evidential',
    )
    expect(await page.locator('[data-test="lost-frequencies"] li').allInnerTexts()).toEqual(
      lostWhenChecked,
    )
    await page.locator('[data-test="restoration"]').scrollIntoViewIfNeeded()
    await browser.screenshot('check-7b-saved-restoration')
    await page.goto(`${baseUrl}${cameraPath}`)
    const saved = page.locator(`[data-test="history-row"][data-check-id="${checkId}"]`)
    await saved.waitFor()
    expect(await saved.locator('[data-test="history-sync"]').innerText()).toContain(
      'waiting to sync',
    )
    await saved.scrollIntoViewIfNeeded()
    await browser.screenshot('check-8-history')

    await page.goto(`${baseUrl}/rounds`)
    expect(await page.locator('[data-test="rounds-pending"]').innerText()).toMatch(
      /1 change waiting to sync/,
    )
    const checkedRow = page.locator('[data-test="camera-row"]', { hasText: assetTag })
    expect(await checkedRow.locator('[data-test="row-local-result"]').innerText()).toMatch(
      /Fail\s+checked here .* waiting to sync/,
    )
    await browser.screenshot('check-9-rounds')

    // A check this device does not hold (made on another phone) says where its pixels are.
    await page.goto(`${baseUrl}/checks/0b6f7a52-9d7e-4c1a-8f3b-2e5d6c7a8b9c`)
    expect(await page.locator('[data-test="check-not-on-device"]').innerText()).toMatch(
      /restoration preview are kept only on the device where it was made/,
    )
    expect(uncaught).toEqual([])
    await context.setOffline(false)
  })
})
