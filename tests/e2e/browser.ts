// Debian's Chromium through playwright-core, with a throwaway profile per launch. Screenshots go
// to test-results/e2e/ (git-ignored) so a person can look at each step.
import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'
import { ROOT } from './harness/root'

export const SCREENSHOT_DIR = join(ROOT, 'test-results', 'e2e')

const CHROMIUM_ARGS = [
  '--headless',
  '--no-sandbox',
  '--disable-gpu',
  '--disable-quic',
  '--no-first-run',
  '--disable-background-networking',
  '--disable-component-update',
  '--disable-sync',
]

export interface TestBrowser {
  context: BrowserContext
  page: Page
  /** Saves what the screen shows as test-results/e2e/<name>.png and returns its path. */
  screenshot(name: string, options?: { fullPage?: boolean }): Promise<string>
  close(): Promise<void>
}

export interface LaunchOptions {
  /** Extra Chromium flags (e.g. a fake camera), after the usual ones. */
  args?: readonly string[]
}

/** A phone-sized window (390 × 844) unless told otherwise. */
export async function launchBrowser(
  viewport = { width: 390, height: 844 },
  options: LaunchOptions = {},
): Promise<TestBrowser> {
  const userDataDir = mkdtempSync(join(tmpdir(), 'sf-chromium-'))
  mkdirSync(SCREENSHOT_DIR, { recursive: true })
  const context = await chromium.launchPersistentContext(userDataDir, {
    executablePath: process.env.SHARPFIELD_CHROMIUM ?? '/usr/bin/chromium',
    headless: true,
    viewport,
    args: [...CHROMIUM_ARGS, ...(options.args ?? [])],
  })
  const page = context.pages()[0] ?? (await context.newPage())
  return {
    context,
    page,
    async screenshot(name, options = {}) {
      const path = join(SCREENSHOT_DIR, `${name}.png`)
      await page.screenshot({ path, fullPage: options.fullPage ?? false })
      return path
    },
    async close() {
      await context.close()
      rmSync(userDataDir, { recursive: true, force: true })
    },
  }
}

export const DEMO_PASSWORD = 'sharpfield-demo'

/** Fills the sign-in form and submits it; the caller checks where it lands. */
export async function signIn(
  page: Page,
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password', { exact: true }).fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
}

/** Waits until a service worker controls the page (reloading once after the first install). */
export async function waitForServiceWorker(page: Page): Promise<void> {
  await page.evaluate(() => navigator.serviceWorker.ready.then(() => undefined))
  const controlled = await page.evaluate(() => navigator.serviceWorker.controller !== null)
  if (!controlled) await page.reload()
  await page.waitForFunction(() => navigator.serviceWorker.controller !== null)
}

/** The labels of the tab bar, in order. */
export async function tabLabels(page: Page): Promise<string[]> {
  const items = page.locator('.van-tabbar-item')
  await items.first().waitFor()
  return (await items.locator('.van-tabbar-item__text').allInnerTexts()).map((t) => t.trim())
}

/** Clicks the tab bar item whose label is exactly `label`. */
export async function openTab(page: Page, label: string): Promise<void> {
  const text = page.locator('.van-tabbar-item__text').getByText(label, { exact: true })
  await page.locator('.van-tabbar-item').filter({ has: text }).click()
}
