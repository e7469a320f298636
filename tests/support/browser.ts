// Debian's Chromium driven by playwright-core: headless, no network beyond loopback, a fresh profile each time.
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { BASE_URL } from './http'

export const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync']

export async function launch(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS })
}

/** A new context that records every request URL, so a test can check none leaves 127.0.0.1. */
export async function newContext(browser: Browser, options: Parameters<Browser['newContext']>[0] = {}) {
  const context = await browser.newContext({ baseURL: BASE_URL, viewport: { width: 1280, height: 860 }, ...options })
  const requests: string[] = []
  context.on('request', (r) => requests.push(r.url()))
  return { context, requests }
}

export function outsideRequests(requests: string[]): string[] {
  return requests.filter((u) => {
    if (u.startsWith('data:') || u.startsWith('blob:') || u === 'about:blank') return false
    const host = new URL(u).hostname
    return host !== '127.0.0.1' && host !== 'localhost'
  })
}

export async function signIn(page: Page, email: string, password = 'wildward-demo') {
  await page.goto('/login')
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(/\/yards/)
}

/** Vue marks the app's root once it has hydrated; before that a click or a change to a form control is lost. */
export function hydrated(page: Page) {
  return page.waitForFunction(() => !!(document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__)
}

export type { Browser, BrowserContext, Page }
