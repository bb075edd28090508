// A work order's whole life through the real UI: a failing check (synced through the API, as a
// phone would) opens it, the supervisor assigns and then reassigns it, the demo Mailbox shows
// both e-mails, maintenance does the work and asks for a re-check, and a passing re-check
// closes it.
import { randomUUID } from 'node:crypto'
import type { Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, signIn, type TestBrowser } from './browser'
import { checkPayload } from '../fixtures/checkPayload'
import { apiAs, apiWith, tokenOf } from './api'

const baseUrl = inject('baseUrl')

/** Sends a check the way the inspector's phone syncs it (no measured edges: the verdict counts). */
async function pushCheck(cameraId: number, verdict: 'pass' | 'fail'): Promise<string> {
  const check = checkPayload(cameraId, {
    capturedAt: new Date().toISOString(),
    verdict,
    reasons: [
      verdict === 'pass'
        ? { code: 'sharp', text: 'MTF50 0.33 cy/px meets the minimum of 0.25.' }
        : { code: 'soft', text: 'MTF50 0.11 cy/px is below the minimum of 0.25.' },
    ],
    medianMtf50CyPx: verdict === 'pass' ? 0.33 : 0.11,
    measurements: [],
  })
  const body = await apiWith<{ results: { status: string }[] }>(
    await tokenOf('inspector@sharpfield.test'),
    '/api/sync/push',
    { deviceId: 'e2e-phone', ops: [{ id: randomUUID(), kind: 'check.create', payload: check }] },
  )
  expect(body.results[0].status).toBe('applied')
  return check.id
}

async function signInAs(page: Page, email: string, home: string): Promise<void> {
  // Drop the previous role's session. A token renewal still in flight can write the session back,
  // so clear until the sign-in form really shows.
  await browser.context.clearCookies()
  for (let attempt = 0; attempt < 5; attempt++) {
    await page.evaluate(() => localStorage.clear()).catch(() => undefined)
    await page.goto(`${baseUrl}/sign-in`)
    await page.evaluate(() => localStorage.clear())
    await page.goto(`${baseUrl}/sign-in`)
    const form = await page
      .getByLabel('E-mail')
      .waitFor({ timeout: 5_000 })
      .then(() => true)
      .catch(() => false)
    if (form) break
  }
  await signIn(page, baseUrl, email)
  await page.waitForURL(`${baseUrl}${home}`)
}

const sheet = (page: Page) => page.locator('[data-test="wo-sheet"]')
const statusText = (page: Page) => page.locator('.wo-head [data-test="wo-status"]').innerText()

let browser: TestBrowser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('work orders end to end', () => {
  it('failing check → assign → reassign → mails → re-check asked → passing re-check closes it', async () => {
    const { page } = browser
    // A camera with no open order gets a failing check.
    const cams = await apiAs<{ items: { id: number; assetTag: string; active: boolean }[] }>(
      'supervisor@sharpfield.test',
      '/api/cameras?limit=500',
    )
    const open = await apiAs<{ items: { cameraId: number }[] }>(
      'supervisor@sharpfield.test',
      '/api/work-orders?status=active&limit=500',
    )
    const camera = cams.items.find((c) => c.active && !open.items.some((o) => o.cameraId === c.id))!
    expect(camera).toBeDefined()
    await pushCheck(camera.id, 'fail')
    const opened = await apiAs<{ items: { id: number; status: string }[] }>(
      'supervisor@sharpfield.test',
      `/api/work-orders?cameraId=${camera.id}&status=active`,
    )
    expect(opened.items.map((o) => o.status)).toEqual(['open'])
    const orderId = opened.items[0].id

    // The supervisor finds it in the list and assigns it to Declan.
    await signInAs(page, 'supervisor@sharpfield.test', '/fleet')
    await page.goto(`${baseUrl}/work-orders`)
    const row = page.locator('[data-test="wo-row"]', { hasText: `#${orderId}` })
    await row.waitFor()
    expect(await row.locator('[data-test="wo-status"]').innerText()).toContain('Open')
    await browser.screenshot('work-orders-list-supervisor')
    await row.click()
    await page.waitForURL(`${baseUrl}/work-orders/${orderId}`)
    expect(await page.locator('[data-test="wo-asset-tag"]').innerText()).toBe(camera.assetTag)
    await page.locator('[data-test="wo-action-assign"]').click()
    await sheet(page).getByText('Declan Moss').click()
    await sheet(page).locator('[data-test="wo-sheet-submit"]').click()
    await expect
      .poll(() => page.locator('[data-test="wo-assignee"]').innerText())
      .toContain('Declan Moss')
    await expect.poll(() => statusText(page)).toContain('Assigned')

    // …then reassigns it to Aiko: a reason is required.
    await page.locator('[data-test="wo-action-reassign"]').click()
    await sheet(page).getByText('Aiko Berg').click()
    await sheet(page).locator('[data-test="wo-sheet-submit"]').click()
    await expect.poll(() => sheet(page).getByRole('alert').innerText()).toContain('Give a reason')
    await sheet(page)
      .locator('[data-test="wo-reason"] textarea')
      .fill('Declan is on the gate job this week.')
    await sheet(page).locator('[data-test="wo-sheet-submit"]').click()
    await expect
      .poll(() => page.locator('[data-test="wo-assignee"]').innerText())
      .toContain('Aiko Berg')
    await expect
      .poll(() => page.locator('[data-test="wo-history"]').innerText())
      .toContain('moved it from Declan Moss to Aiko Berg')
    await browser.screenshot('work-order-reassigned')

    // The demo Mailbox shows the assignment and the reassignment e-mails.
    await page.goto(`${baseUrl}/mailbox`)
    const subjects = async () => {
      await page.locator('[data-test="mailbox-refresh"]').click()
      await page.waitForTimeout(300)
      return page.locator('[data-test="mailbox-subject"]').allInnerTexts()
    }
    await expect
      .poll(subjects, { timeout: 30_000, interval: 1000 })
      .toEqual(
        expect.arrayContaining([
          `Work order #${orderId} assigned to you: ${camera.assetTag}`,
          `Work order #${orderId} reassigned to you: ${camera.assetTag}`,
          `Work order #${orderId} moved to Aiko Berg`,
        ]),
      )
    const reassignedMail = page.locator('[data-test="mailbox-item"]', {
      hasText: `Work order #${orderId} reassigned to you`,
    })
    await reassignedMail.locator('.van-collapse-item__title').click()
    await expect
      .poll(() => reassignedMail.locator('[data-test="mailbox-text"]').innerText())
      .toContain('Declan is on the gate job this week.')
    await browser.screenshot('mailbox-work-order-mails')

    // Aiko (maintenance) sees the order, with the safety reminder, starts and asks for a re-check.
    await signInAs(page, 'maintenance2@sharpfield.test', '/work-orders')
    await page.locator('[data-test="wo-row"]', { hasText: `#${orderId}` }).click()
    await page.waitForURL(`${baseUrl}/work-orders/${orderId}`)
    expect(await page.locator('[data-test="wo-safety"]').innerText()).toContain(
      'isolate the supply',
    )
    expect(await page.locator('[data-test="wo-action-reassign"]').count()).toBe(0)
    await page.locator('[data-test="wo-action-start"]').click()
    await expect.poll(() => statusText(page)).toContain('In progress')
    await page.locator('[data-test="wo-action-request_recheck"]').click()
    await sheet(page)
      .locator('[data-test="wo-note"] textarea')
      .fill('Refocused with the iris open; dome cleaned.')
    await sheet(page).locator('[data-test="wo-sheet-submit"]').click()
    await expect.poll(() => statusText(page)).toContain('Awaiting re-check')
    await browser.screenshot('work-order-maintenance-done')

    // The inspector's passing re-check closes it, recording which check did.
    const recheck = await pushCheck(camera.id, 'pass')
    await signInAs(page, 'supervisor@sharpfield.test', '/fleet')
    await page.goto(`${baseUrl}/work-orders/${orderId}`)
    await expect.poll(() => statusText(page)).toContain('Closed')
    expect(await page.locator('[data-test="wo-closed-by"]').innerText()).toContain(recheck)
    expect(await page.locator('[data-test="wo-actions"]').count()).toBe(0)
    await browser.screenshot('work-order-closed', { fullPage: true })
  })
})
