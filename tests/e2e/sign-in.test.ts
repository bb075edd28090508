// Each role signs in through the real UI and lands on its own home with its own tab bar; the
// screens show what the server holds; wrong passwords and other roles' pages are refused.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import {
  launchBrowser,
  openTab,
  signIn,
  tabLabels,
  DEMO_PASSWORD,
  type TestBrowser,
} from './browser'
import { apiAs } from './api'

const baseUrl = inject('baseUrl')

let browser: TestBrowser
beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

const ROLES = [
  { role: 'inspector', home: '/rounds', tabs: ['Rounds', 'Sync', 'Tools', 'Me'] },
  { role: 'supervisor', home: '/fleet', tabs: ['Fleet', 'Work orders', 'Cameras', 'Me'] },
  { role: 'maintenance', home: '/work-orders', tabs: ['Work orders', 'Me'] },
  { role: 'admin', home: '/setup', tabs: ['Setup', 'Fleet', 'Me'] },
] as const

describe('signing in', () => {
  for (const { role, home, tabs } of ROLES) {
    it(`the ${role} lands on ${home} with the ${role}'s tab bar`, async () => {
      const { page, context } = browser
      await context.clearCookies()
      await page.goto(`${baseUrl}/sign-in`)
      await page.evaluate(() => localStorage.clear())
      await signIn(page, baseUrl, `${role}@sharpfield.test`)
      await page.waitForURL(`${baseUrl}${home}`)
      expect(await tabLabels(page)).toEqual(tabs)
      await expect.poll(() => page.locator('.van-tabbar-item--active').innerText()).toBe(tabs[0])

      if (role === 'inspector') {
        // The list holds exactly the cameras the server has, grouped by site.
        const api = (await apiAs('inspector@sharpfield.test', '/api/cameras?limit=500')) as {
          total: number
        }
        expect(api.total).toBeGreaterThan(0)
        await page.getByRole('tab', { name: `All cameras (${api.total})` }).click()
        await expect.poll(() => page.locator('[data-test="camera-row"]').count()).toBe(api.total)

        // The shipped font is in use (not a system fallback) and touch targets are at least 44 px.
        const interFaces = await page.evaluate(async () => {
          await document.fonts.ready
          return [...document.fonts].filter(
            (f) => f.family.replace(/"|'/g, '') === 'Inter' && f.status === 'loaded',
          ).length
        })
        expect(interFaces).toBeGreaterThan(0)
        expect(await page.evaluate(() => getComputedStyle(document.body).fontFamily)).toMatch(
          /^"?Inter"?,/,
        )
        const heights = await page
          .locator('.van-tabbar-item, [data-test="camera-row"], .van-tab, .van-search__field')
          .evaluateAll((els) => els.map((el) => el.getBoundingClientRect().height))
        expect(Math.min(...heights)).toBeGreaterThanOrEqual(44)
      }
      if (role === 'supervisor' || role === 'admin') {
        const api = (await apiAs(`${role}@sharpfield.test`, '/api/cameras?limit=500')) as {
          items: { active: boolean; siteId: number }[]
        }
        const active = api.items.filter((c) => c.active)
        const sites = new Set(active.map((c) => c.siteId)).size
        if (role === 'supervisor') {
          await expect
            .poll(() => page.locator('[data-test="count-cameras"] .count-tile__value').innerText())
            .toBe(String(active.length))
          await expect
            .poll(() => page.locator('[data-test="fleet-by-site"] [data-test="count-row"]').count())
            .toBe(sites)
        } else {
          await expect
            .poll(() => page.locator('[data-test="setup-users"]').innerText())
            .toContain('inspector@sharpfield.test')
          await openTab(page, 'Fleet')
          await page.waitForURL(`${baseUrl}/fleet`)
          await expect
            .poll(() => page.locator('[data-test="count-cameras"] .count-tile__value').innerText())
            .toBe(String(active.length))
          await expect
            .poll(() => page.locator('[data-test="fleet-by-site"] [data-test="count-row"]').count())
            .toBe(sites)
          await page.goBack()
        }
      }
      if (role === 'maintenance') {
        // "My work orders": exactly the ones the server has assigned to this user.
        const mine = (await apiAs(
          'maintenance@sharpfield.test',
          '/api/work-orders?status=active',
        )) as { total: number }
        await expect
          .poll(() => page.locator('[data-test="wo-count"]').innerText())
          .toMatch(new RegExp(`^${mine.total} orders?`))
      }
      await browser.screenshot(`home-${role}`)

      // Me shows who is signed in; signing out returns to the sign-in screen.
      await openTab(page, 'Me')
      await expect
        .poll(() => page.locator('[data-test="me-role"]').innerText())
        .toContain(role === 'admin' ? 'Administrator' : role[0].toUpperCase() + role.slice(1))
      await page.locator('[data-test="sign-out"]').click()
      await page.getByRole('button', { name: 'Sign out' }).last().click()
      await page.waitForURL(/\/sign-in/)
      expect(await page.evaluate(() => localStorage.getItem('sharpfield.session'))).toBeNull()
    })
  }

  it('a wrong password shows a clear error and stays on the sign-in screen', async () => {
    const { page } = browser
    await signIn(page, baseUrl, 'supervisor@sharpfield.test', 'not-the-password')
    const error = page.locator('[data-test="sign-in-error"]')
    await error.waitFor()
    expect(await error.innerText()).toContain('Wrong e-mail or password')
    expect(new URL(page.url()).pathname).toBe('/sign-in')
    expect(await page.locator('.van-tabbar').count()).toBe(0)
    await browser.screenshot('sign-in-wrong-password')
  })

  it('works with the keyboard alone, and returns to the page that asked for sign-in', async () => {
    const { page } = browser
    await page.goto(`${baseUrl}/safety`)
    await page.goto(`${baseUrl}/me`)
    await page.waitForURL(/\/sign-in\?redirect=(%2F|\/)me$/)
    await page.getByLabel('E-mail').focus()
    await page.keyboard.type('inspector@sharpfield.test')
    await page.keyboard.press('Tab')
    await page.keyboard.type(DEMO_PASSWORD)
    await page.keyboard.press('Enter')
    await page.waitForURL(`${baseUrl}/me`)
    expect(await page.locator('[data-test="me-name"]').innerText()).toContain('Ines Okafor')

    // Tab-bar items and list rows are not native buttons; Enter still opens them.
    await page.locator('.van-tabbar-item').first().focus()
    await page.keyboard.press('Enter')
    await page.waitForURL(`${baseUrl}/rounds`)
    await page.getByRole('tab', { name: /All cameras/ }).focus()
    await page.keyboard.press('Enter')
    const row = page.locator('[data-test="camera-row"]').first()
    await row.waitFor()
    await row.focus()
    await page.keyboard.press('Enter')
    await page.waitForURL(/\/cameras\/\d+$/)
    await page.goBack()
  })

  it('the inspector finds the sync queue, the tools and the safety notes', async () => {
    const { page } = browser
    await openTab(page, 'Sync')
    await page.waitForURL(`${baseUrl}/sync`)
    expect(await page.locator('[data-test="sync-empty"]').innerText()).toContain(
      'Nothing waiting to sync',
    )
    // Signed in straight to /me, never opened Rounds: the cameras were still saved for offline use.
    await expect
      .poll(() => page.getByText(/\d+ cameras saved/).innerText())
      .toMatch(/^[1-9]\d* cameras saved$/)
    await browser.screenshot('sync-inspector')
    await openTab(page, 'Tools')
    await page.getByText('Safety notes').click()
    await page.waitForURL(`${baseUrl}/safety`)
    const headings = await page.locator('h2').allInnerTexts()
    expect(headings.map((h) => h.trim())).toEqual([
      'Working at height',
      'Roadside and traffic',
      'Electrical',
      'Infrared illuminators',
      'Personal data',
    ])
    expect(await page.getByRole('note').innerText()).toContain(
      "your employer's procedures come first",
    )
    expect(await page.locator('.van-tabbar-item--active').innerText()).toContain('Tools')
    await browser.screenshot('safety', { fullPage: true })
    await openTab(page, 'Me')
    await browser.screenshot('me-inspector')
  })

  it("a role opening another role's page is sent to its own home with a notice", async () => {
    const { page } = browser
    await page.goto(`${baseUrl}/setup`)
    await page.waitForURL(`${baseUrl}/rounds`)
    await expect
      .poll(() => page.locator('.van-toast').innerText())
      .toContain('not part of the Inspector role')
    await browser.screenshot('role-guard-inspector-setup')
  })
})
