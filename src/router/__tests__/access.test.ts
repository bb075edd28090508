import { describe, expect, it } from 'vitest'
import { routes } from '../routes'
import { decideAccess } from '../access'
import { ROLE_HOME, ROLE_TABS, type Role } from '../roles'

const ROLES: Role[] = ['inspector', 'supervisor', 'maintenance', 'admin']
const metaOf = (path: string) => routes.find((r) => r.path === path)?.meta ?? {}

describe('route access', () => {
  it('without a session every protected page goes to sign-in; public pages open', () => {
    expect(decideAccess(metaOf('/rounds'), null, false)).toEqual({ kind: 'sign-in' })
    expect(decideAccess(metaOf('/me'), null, false)).toEqual({ kind: 'sign-in' })
    expect(decideAccess(metaOf('/safety'), null, false)).toEqual({ kind: 'allow' })
    expect(decideAccess(metaOf('/sign-in'), null, true)).toEqual({ kind: 'allow' })
  })

  it('a signed-in user asking for sign-in goes home without a warning', () => {
    expect(decideAccess(metaOf('/sign-in'), 'admin', true)).toEqual({ kind: 'home', denied: false })
  })

  it("every role may open its home and its tabs, and is sent home from another role's page", () => {
    for (const role of ROLES) {
      expect(decideAccess(metaOf(ROLE_HOME[role]), role, false)).toEqual({ kind: 'allow' })
      for (const tab of ROLE_TABS[role])
        expect(decideAccess(metaOf(tab.to), role, false)).toEqual({ kind: 'allow' })
    }
    expect(decideAccess(metaOf('/fleet'), 'inspector', false)).toEqual({
      kind: 'home',
      denied: true,
    })
    expect(decideAccess(metaOf('/setup'), 'supervisor', false)).toEqual({
      kind: 'home',
      denied: true,
    })
    expect(decideAccess(metaOf('/rounds'), 'maintenance', false)).toEqual({
      kind: 'home',
      denied: true,
    })
    expect(decideAccess(metaOf('/work-orders'), 'admin', false)).toEqual({
      kind: 'home',
      denied: true,
    })
  })
})
