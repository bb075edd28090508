import type { Request, Response } from 'express'

export const REFRESH_COOKIE = 'sf_refresh'
const REFRESH_COOKIE_PATH = '/api/auth'

/** Reads one cookie from the Cookie header (no parser dependency needed for one value). */
export function readCookie(req: Request, name: string): string | undefined {
  const header = req.get('cookie')
  if (!header) return undefined
  for (const part of header.split(';')) {
    const eq = part.indexOf('=')
    if (eq < 0) continue
    if (part.slice(0, eq).trim() !== name) continue
    try {
      return decodeURIComponent(part.slice(eq + 1).trim())
    } catch {
      return undefined
    }
  }
  return undefined
}

/** httpOnly, SameSite=Strict, scoped to /api/auth; Secure whenever the request came over HTTPS. */
export function setRefreshCookie(
  req: Request,
  res: Response,
  token: string,
  maxAgeMs: number,
): void {
  res.cookie(REFRESH_COOKIE, token, {
    httpOnly: true,
    sameSite: 'strict',
    secure: req.secure,
    path: REFRESH_COOKIE_PATH,
    maxAge: maxAgeMs,
  })
}

export function clearRefreshCookie(req: Request, res: Response): void {
  res.clearCookie(REFRESH_COOKIE, {
    httpOnly: true,
    sameSite: 'strict',
    secure: req.secure,
    path: REFRESH_COOKIE_PATH,
  })
}
