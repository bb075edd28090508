// The supervisor's week through the real UI: the fleet view with its counts and charts, a site
// filter, the failing cameras in the camera table, one failing camera's history and last
// check, a CSV export and the acceptance record as a PDF — on a phone and on a desktop.
import { readFileSync } from 'node:fs'
import Papa from 'papaparse'
import type { Download, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, signIn, type TestBrowser } from './browser'
import { apiAs } from './api'

const baseUrl = inject('baseUrl')
const SUPERVISOR = 'supervisor@sharpfield.test'
const apiGet = <T>(path: string) => apiAs<T>(SUPERVISOR, path)

async function downloaded(
  page: Page,
  click: () => Promise<void>,
): Promise<{ name: string; bytes: Buffer }> {
  const [download] = (await Promise.all([page.waitForEvent('download'), click()])) as [
    Download,
    void,
  ]
  const path = await download.path()
  return { name: download.suggestedFilename(), bytes: readFileSync(path) }
}

interface Summary {
  overall: { cameras: number; failing: number }
  bySite: { siteId: number; siteName: string; cameras: number }[]
}

let phone: TestBrowser
let desk: TestBrowser
beforeAll(async () => {
  phone = await launchBrowser()
  desk = await launchBrowser({ width: 1280, height: 900 })
})
afterAll(async () => {
  await phone?.close()
  await desk?.close()
})

describe('the supervisor’s fleet view', () => {
  it('shows the counts, narrows them to a site, and lists the failing cameras', async () => {
    const { page } = phone
    await signIn(page, baseUrl, SUPERVISOR)
    await page.waitForURL(`${baseUrl}/fleet`)
    const all = await apiGet<Summary>('/api/fleet/summary')
    const camerasTile = page.locator('[data-test="count-cameras"] .count-tile__value')
    await expect.poll(() => camerasTile.innerText()).toBe(String(all.overall.cameras))
    await page.locator('[data-test="pass-rate-chart"] canvas').waitFor()
    await phone.screenshot('fleet-phone', { fullPage: true })

    // Filter to one site: the counts are the server's for that site.
    const site = all.bySite[0]
    await page.locator('.fleet-filters select[name="siteId"]').selectOption(String(site.siteId))
    await expect.poll(() => camerasTile.innerText()).toBe(String(site.cameras))
    await expect
      .poll(() => page.locator('[data-test="fleet-by-site"] [data-test="count-row"]').count())
      .toBe(1)
    await phone.screenshot('fleet-phone-site-filter')
    await page.locator('.fleet-filters select[name="siteId"]').selectOption('')
    await expect.poll(() => camerasTile.innerText()).toBe(String(all.overall.cameras))
  })

  it('opens a failing camera: its history, last check with MTF curves, CSV and PDF', async () => {
    const { page } = phone
    const failing = await apiGet<{ total: number; items: { id: number; assetTag: string }[] }>(
      '/api/fleet/cameras?state=failing&limit=200',
    )
    expect(failing.total).toBeGreaterThan(0)
    await page.goto(`${baseUrl}/cameras?state=failing`)
    await expect
      .poll(() => page.locator('[data-test="camera-row"]').count())
      .toBe(Math.min(25, failing.total))
    await expect
      .poll(() => page.locator('[data-test="camera-total"]').innerText())
      .toContain(`${failing.total} camera`)
    await phone.screenshot('cameras-failing-phone', { fullPage: true })

    await page.locator('[data-test="camera-row"]').first().click()
    await page.waitForURL(/\/fleet\/cameras\/\d+$/)
    const id = Number(page.url().split('/').pop())
    const first = failing.items.find((c) => c.id === id)!
    await expect
      .poll(() => page.locator('[data-test="camera-asset-tag"]').innerText())
      .toBe(first.assetTag)
    await page.locator('[data-test="check-detail"]').waitFor()
    await expect
      .poll(() => page.locator('[data-test="check-detail"] [data-test="verdict-tag"]').innerText())
      .toContain('Fail')
    await page.locator('[data-test="trend-chart"] canvas').waitFor()
    await page.locator('[data-test="mtf-curve-chart"] canvas').waitFor()
    await phone.screenshot('camera-history-phone', { fullPage: true })

    const history = await apiGet<{ checks: { id: string }[] }>(
      `/api/fleet/cameras/${id}/history?limit=1000`,
    )
    const csv = await downloaded(page, () =>
      page.locator('[data-test="camera-export-csv"]').click(),
    )
    expect(csv.name).toMatch(/^sharpfield-checks-.*\.csv$/)
    const parsed = Papa.parse<Record<string, string>>(
      csv.bytes.toString('utf8').replace(/^\uFEFF/, ''),
      { header: true, skipEmptyLines: true },
    )
    expect(parsed.meta.fields).toContain('median_mtf50_cy_px')
    expect(parsed.meta.fields).toContain('pixel_density_px_per_m')
    expect(parsed.data).toHaveLength(history.checks.length)
    expect(new Set(parsed.data.map((r) => r.asset_tag))).toEqual(new Set([first.assetTag]))

    const pdf = await downloaded(page, () =>
      page.locator('[data-test="download-acceptance"]').click(),
    )
    expect(pdf.name).toMatch(
      new RegExp(`^sharpfield-acceptance-${first.assetTag}-\\d{4}-\\d{2}-\\d{2}\\.pdf$`),
    )
    expect(pdf.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-')
  })

  it('exports the period’s checks and the summary PDF from the fleet view', async () => {
    const { page } = phone
    await page.goto(`${baseUrl}/fleet`)
    await page.locator('[data-test="export-checks"]').waitFor()
    const csv = await downloaded(page, () => page.locator('[data-test="export-checks"]').click())
    const rows = Papa.parse<Record<string, string>>(
      csv.bytes.toString('utf8').replace(/^\uFEFF/, ''),
      { header: true, skipEmptyLines: true },
    )
    expect(rows.meta.fields?.[0]).toBe('check_id')
    expect(rows.data.length).toBeGreaterThan(0)
    const pdf = await downloaded(page, () =>
      page.locator('[data-test="export-summary-pdf"]').click(),
    )
    expect(pdf.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-')
  })

  it('on a desktop: the counts side by side and the camera table as a table', async () => {
    const { page } = desk
    await signIn(page, baseUrl, SUPERVISOR)
    await page.waitForURL(`${baseUrl}/fleet`)
    await page.locator('[data-test="mtf-distribution-chart"] canvas').waitFor()
    await desk.screenshot('fleet-desktop', { fullPage: true })
    await page.goto(`${baseUrl}/cameras?sort=lastMtf50CyPx`)
    await page.locator('table[data-test="camera-table"]').waitFor()
    // Sorting by a column header: lowest MTF50 first, then highest first.
    const mtf = () => page.locator('[data-test="camera-row"] td:nth-child(7)').allInnerTexts()
    await expect.poll(async () => (await mtf()).length).toBeGreaterThan(1)
    const asc = (await mtf()).map((t) => parseFloat(t)).filter(Number.isFinite)
    expect(asc).toEqual([...asc].sort((a, b) => a - b))
    await page.getByRole('button', { name: /MTF50/ }).click()
    await page.waitForURL(/order=desc/)
    await expect
      .poll(async () => (await mtf()).map((t) => parseFloat(t)).filter(Number.isFinite)[0])
      .toBeGreaterThanOrEqual(asc[asc.length - 1])
    await desk.screenshot('cameras-desktop', { fullPage: true })
    await page.locator('[data-test="camera-row"]').first().click()
    await page.locator('[data-test="check-detail"]').waitFor()
    await page.locator('[data-test="mtf-curve-chart"] canvas').waitFor()
    await desk.screenshot('camera-history-desktop', { fullPage: true })
  })
})

describe('rounds and thresholds', () => {
  it('the supervisor assigns a whole site to an inspector, then cancels the round', async () => {
    const { page } = phone
    await page.goto(`${baseUrl}/fleet/rounds`)
    await page.locator('[data-test="new-round"]').click()
    const form = page.locator('[data-test="round-form"]')
    await form.getByRole('button', { name: 'Assign round' }).click()
    await expect
      .poll(() => form.locator('.van-field__error-message, .select-field__error').allInnerTexts())
      .toContain('Give the round a name.')
    await form.getByLabel('Name').fill('E2E depot sweep')
    await form.locator('select[name="assigneeId"]').selectOption({ label: 'Ines Okafor' })
    await form.locator('select[name="siteId"]').selectOption({ index: 1 })
    await phone.screenshot('rounds-new-phone')
    await form.getByRole('button', { name: 'Assign round' }).click()
    const row = page.locator('[data-test="round-row"]').filter({ hasText: 'E2E depot sweep' })
    await row.waitFor()
    expect(await row.innerText()).toContain('Ines Okafor')
    const open = await apiGet<{ items: { name: string; cameraCount: number; status: string }[] }>(
      '/api/rounds?status=open',
    )
    const made = open.items.find((r) => r.name === 'E2E depot sweep')!
    expect(made.cameraCount).toBeGreaterThan(0)
    await phone.screenshot('rounds-list-phone')
    await row.getByRole('button', { name: 'Cancel' }).click()
    await page.getByRole('button', { name: 'Cancel round' }).click()
    await expect.poll(() => row.count()).toBe(0)
    const cancelled = await apiGet<{ items: { name: string }[] }>('/api/rounds?status=cancelled')
    expect(cancelled.items.map((r) => r.name)).toContain('E2E depot sweep')
  })

  it('the supervisor changes a task threshold; a value out of range is refused on the field', async () => {
    const { page } = phone
    await page.goto(`${baseUrl}/fleet/thresholds`)
    await page.locator('[data-test="task-row"]').filter({ hasText: 'Recognise' }).click()
    const form = page.locator('[data-test="entity-form"]')
    await form.getByLabel('Minimum MTF50').fill('2')
    await form.getByRole('button', { name: 'Save' }).click()
    await expect
      .poll(() => form.locator('.van-field__error-message').allInnerTexts())
      .toEqual(['At most 1 cycle/pixel.'])
    await phone.screenshot('thresholds-error-phone')
    await form.getByLabel('Minimum MTF50').fill('0.21')
    await form.getByRole('button', { name: 'Save' }).click()
    await expect
      .poll(() =>
        page.locator('[data-test="task-row"]').filter({ hasText: 'Recognise' }).innerText(),
      )
      .toContain('0.21 c/px')
    const tasks = await apiGet<{ items: { id: string; minMtf50CyPx: number }[] }>('/api/tasks')
    expect(tasks.items.find((t) => t.id === 'recognise')?.minMtf50CyPx).toBe(0.21)
  })
})
