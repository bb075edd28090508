// Sign-in, who-am-I and sign-out. (Refresh happens inside http.ts.)
import {
  meResponseSchema,
  sessionResponseSchema,
  type SessionResponse,
  type SessionUser,
} from '@shared/schemas/auth'
import { http, type SessionTokens } from './http'

export type { SessionResponse, SessionUser }

export function login(email: string, password: string): Promise<SessionResponse> {
  return http.post(
    '/api/auth/login',
    { email, password },
    { auth: false, schema: sessionResponseSchema },
  )
}

export async function fetchMe(): Promise<SessionUser> {
  const answer = await http.get('/api/auth/me', { schema: meResponseSchema })
  return answer.user
}

/** Revokes the refresh token on the server. Sent with the given tokens, never refreshed. */
export async function logout(tokens: SessionTokens): Promise<void> {
  await http.post(
    '/api/auth/logout',
    { refreshToken: tokens.refreshToken },
    { auth: false, bearer: tokens.token },
  )
}
