// The administrator's setup through the real UI: a form refuses invalid input field by field;
// a camera CSV with one wrong row imports nothing; fixed, it imports every row.
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { launchBrowser, signIn, type TestBrowser } from './browser'
import { apiAs } from './api'

const baseUrl = inject('baseUrl')
const ADMIN = 'admin@sharpfield.test'
const dir = mkdtempSync(join(tmpdir(), 'sf-e2e-csv-'))

async function cameraTags(q: string): Promise<string[]> {
  const list = await apiAs<{ items: { assetTag: string }[] }>(
    ADMIN,
    `/api/cameras?q=${encodeURIComponent(q)}&limit=500`,
  )
  return list.items.map((c) => c.assetTag).sort()
}

function csvFile(name: string, rows: string[]): string {
  const path = join(dir, name)
  writeFileSync(
    path,
    ['asset_tag,site,camera_model,task,location,min_mtf50_cy_px', ...rows].join('\r\n'),
  )
  return path
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

describe('setup', () => {
  it('a new-user form shows what is wrong under each field', async () => {
    const { page } = phone
    await signIn(page, baseUrl, ADMIN)
    await page.waitForURL(`${baseUrl}/setup`)
    await page.locator('[data-test="user-row"]').first().waitFor()
    await page.locator('[data-test="new-user"]').click()
    const form = page.locator('[data-test="entity-form"]')
    await form.getByLabel('E-mail').fill('not an address')
    await form.getByLabel('First password').fill('short')
    await form.getByRole('button', { name: 'Save' }).click()
    await expect
      .poll(() => form.locator('.van-field__error-message').allInnerTexts())
      .toEqual(['Enter a name.', 'Enter an e-mail address.', 'At least 12 characters.'])
    await phone.screenshot('setup-user-form-errors')
    await form.getByLabel('Name').fill('Priya Natarajan')
    await form.getByLabel('E-mail').fill('priya.natarajan@sharpfield.test')
    await form.getByLabel('First password').fill('a-long-first-password')
    await form.getByRole('button', { name: 'Save' }).click()
    await expect
      .poll(() => page.locator('[data-test="user-row"]').allInnerTexts())
      .toContainEqual(expect.stringContaining('Priya Natarajan'))
  })

  it('a camera CSV with a wrong row imports nothing; once fixed, every row', async () => {
    const { page } = phone
    await page.goto(`${baseUrl}/setup?tab=import`)
    const rows = [
      'E2E-IMP-01,Millbrook Tram Depot,Corvid D2 dome,recognise,Platform 3 north,0.22',
      'E2E-IMP-02,Millbrook Tram Depot,Corvid D2 dome,observe,Platform 3 south,',
    ]
    await page
      .locator('[data-test="import-file"]')
      .setInputFiles(
        csvFile('bad.csv', [
          ...rows,
          'E2E-IMP-03,Millbrook Tram Depot,Corvid D2 dome,juggling,Car park,',
        ]),
      )
    await expect
      .poll(() => page.locator('[data-test="import-summary"]').innerText())
      .toContain('1 of 3 rows have errors')
    await expect.poll(() => page.locator('[data-test="import-bad-row"]').count()).toBe(1)
    await expect
      .poll(() => page.locator('.csv-import__errors').innerText())
      .toContain('Line 4, task: There is no task "juggling".')
    expect(await page.locator('[data-test="import-commit"]').isDisabled()).toBe(true)
    await phone.screenshot('setup-import-error-phone', { fullPage: true })
    expect(await cameraTags('E2E-IMP')).toEqual([])

    await page
      .locator('[data-test="import-file"]')
      .setInputFiles(
        csvFile('fixed.csv', [
          ...rows,
          'E2E-IMP-03,Millbrook Tram Depot,Corvid D2 dome,monitor,Car park,',
        ]),
      )
    await expect
      .poll(() => page.locator('[data-test="import-summary"]').innerText())
      .toBe('All 3 rows are valid.')
    await page.locator('[data-test="import-commit"]').click()
    await expect
      .poll(() => page.locator('[data-test="import-done"]').innerText())
      .toBe('3 cameras imported.')
    expect(await cameraTags('E2E-IMP')).toEqual(['E2E-IMP-01', 'E2E-IMP-02', 'E2E-IMP-03'])
    await phone.screenshot('setup-import-done-phone')
  })

  it('on a desktop: the import preview and the audit log', async () => {
    const { page } = desk
    await signIn(page, baseUrl, ADMIN)
    await page.waitForURL(`${baseUrl}/setup`)
    await page.goto(`${baseUrl}/setup?tab=import`)
    await page
      .locator('[data-test="import-file"]')
      .setInputFiles(
        csvFile('again.csv', [
          'E2E-IMP-01,Millbrook Tram Depot,Corvid D2 dome,recognise,Again,',
          'E2E-IMP-09,Nowhere,Corvid D2 dome,recognise,,=1+1',
        ]),
      )
    await expect.poll(() => page.locator('[data-test="import-bad-row"]').count()).toBe(2)
    await desk.screenshot('setup-import-error-desktop', { fullPage: true })
    await page.goto(`${baseUrl}/setup/audit`)
    await expect
      .poll(() => page.locator('[data-test="audit-row"]').first().innerText())
      .toContain('camera.import')
    await page.locator('[data-test="audit-row"]').first().click()
    await desk.screenshot('audit-log-desktop', { fullPage: true })
  })
})
