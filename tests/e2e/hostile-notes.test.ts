// Script in a check's notes, as a device could send it, seen by the supervisor in real Chromium:
// the notes show as plain text, nothing runs, and the app works under its Content-Security-Policy
// without a single violation.
import { randomUUID } from 'node:crypto'
import type { ConsoleMessage } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { checkPayload } from '../fixtures/checkPayload'
import { launchBrowser, signIn, type TestBrowser } from './browser'
import { apiWith, tokenOf } from './api'

const baseUrl = inject('baseUrl')
const HOSTILE_NOTES =
  '<img src=x onerror="window.__sfInjected=1"><script>window.__sfInjected=2</script> lens wiped'

let browser: TestBrowser
beforeAll(async () => {
  browser = await launchBrowser({ width: 1280, height: 900 })
})
afterAll(async () => {
  await browser?.close()
})

describe('script in check notes', () => {
  it('shows as text to the supervisor, runs nothing, and breaks no content policy', async () => {
    const inspector = await tokenOf('inspector@sharpfield.test')
    const supervisor = await tokenOf('supervisor@sharpfield.test')
    const { items } = await apiWith<{ items: { id: number; lastCheckAt: string | null }[] }>(
      supervisor,
      '/api/cameras?limit=50',
    )
    const camera = items.find((c) => c.lastCheckAt !== null)!
    // A passing check an hour older than the camera's last one: it changes no camera state.
    const check = checkPayload(camera.id, {
      capturedAt: new Date(Date.parse(camera.lastCheckAt!) - 3600_000).toISOString(),
      notes: HOSTILE_NOTES,
    })
    const pushed = await apiWith<{ results: { status: string }[] }>(inspector, '/api/sync/push', {
      deviceId: `e2e-notes-${randomUUID().slice(0, 8)}`,
      ops: [{ id: randomUUID(), kind: 'check.create', payload: check }],
    })
    expect(pushed.results[0].status).toBe('applied')

    const { page } = browser
    const violations: string[] = []
    const onConsole = (m: ConsoleMessage) => {
      if (/Content Security Policy|Refused to/i.test(m.text())) violations.push(m.text())
    }
    page.on('console', onConsole)
    let dialogs = 0
    page.on('dialog', (d) => {
      dialogs++
      void d.dismiss()
    })
    const first = await page.goto(`${baseUrl}/sign-in`)
    const csp = first?.headers()['content-security-policy'] ?? ''
    expect(csp).toMatch(/script-src 'self'/)
    expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/)

    await signIn(page, baseUrl, 'supervisor@sharpfield.test')
    await page.waitForURL(`${baseUrl}/fleet`)
    await page.goto(`${baseUrl}/fleet/cameras/${camera.id}`)
    const rows = page.locator('[data-test="history-row"]')
    await expect.poll(() => rows.count()).toBeGreaterThan(1)
    // The history lists the newest first; the pushed check is an hour older than the latest.
    const history = await apiWith<{ checks: { id: string }[] }>(
      supervisor,
      `/api/fleet/cameras/${camera.id}/history`,
    )
    const at = history.checks.findIndex((c) => c.id === check.id)
    expect(at).toBeGreaterThanOrEqual(0)
    await rows.nth(at).click()
    const notes = page.locator('.check-card__notes')
    await expect.poll(() => notes.innerText()).toContain(HOSTILE_NOTES)
    expect(await notes.locator('img, script').count()).toBe(0)
    expect(await page.evaluate(() => (window as { __sfInjected?: number }).__sfInjected)).toBe(
      undefined,
    )
    expect(dialogs).toBe(0)
    await browser.screenshot('hostile-notes-as-text')
    page.off('console', onConsole)
    expect(violations).toEqual([])
  })
})
