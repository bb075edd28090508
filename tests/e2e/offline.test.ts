// The app opens with no network once the service worker controls it: signed in, with the
// offline badge, the cameras saved on the device, and deep links too.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, signIn, tabLabels, waitForServiceWorker, type TestBrowser } from './browser'

const baseUrl = inject('baseUrl')

let browser: TestBrowser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('offline', () => {
  it('after the service worker takes over, a reload and a deep link work with the network off', async () => {
    const { page, context } = browser
    await signIn(page, baseUrl, 'inspector@sharpfield.test')
    await page.waitForURL(`${baseUrl}/rounds`)
    await waitForServiceWorker(page)

    // Online: the full camera list is downloaded and saved on the device.
    await page.getByRole('tab', { name: /All cameras/ }).click()
    await expect.poll(() => page.locator('[data-test="camera-row"]').count()).toBeGreaterThan(0)
    const onlineCount = await page.locator('[data-test="camera-row"]').count()
    expect(await page.locator('[data-test="offline-badge"]').count()).toBe(0)
    const firstRow = page.locator('[data-test="camera-row"]').first()
    const assetTag = (await firstRow.locator('.camera-row__tag').innerText()).trim()
    await firstRow.click()
    await page.waitForURL(/\/cameras\/\d+$/)
    const cameraPath = new URL(page.url()).pathname

    await context.setOffline(true)
    // Proof the browser really is offline: the API cannot be reached.
    expect(
      await page.evaluate(() =>
        fetch('/api/health').then(
          () => 'reached',
          () => 'failed',
        ),
      ),
    ).toBe('failed')

    await page.goto(`${baseUrl}/rounds`)
    await page.locator('[data-test="offline-badge"]').waitFor()
    expect(await tabLabels(page)).toEqual(['Rounds', 'Sync', 'Tools', 'Me'])
    await page.getByRole('tab', { name: /All cameras/ }).click()
    await expect.poll(() => page.locator('[data-test="camera-row"]').count()).toBe(onlineCount)
    expect(await page.locator('[data-test="catalog-status"]').innerText()).toContain(
      'Offline: showing data saved on this device',
    )
    await browser.screenshot('offline-rounds')

    await page.reload()
    await page.locator('[data-test="offline-badge"]').waitFor()
    expect(new URL(page.url()).pathname).toBe('/rounds')

    // A deep link typed into the address bar while offline.
    await page.goto(`${baseUrl}${cameraPath}`)
    await page.locator('[data-test="camera-asset-tag"]').waitFor()
    expect(await page.locator('[data-test="camera-asset-tag"]').innerText()).toBe(assetTag)
    expect(await page.locator('[data-test="offline-badge"]').isVisible()).toBe(true)
    await browser.screenshot('offline-camera-deep-link')

    await page.goto(`${baseUrl}/me`)
    expect(await page.locator('[data-test="me-role"]').innerText()).toContain('Inspector')

    await context.setOffline(false)
    await page.reload()
    await expect.poll(() => page.locator('[data-test="offline-badge"]').count()).toBe(0)
  })
})
