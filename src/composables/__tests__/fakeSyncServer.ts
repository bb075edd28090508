// A stand-in for the sync API in engine tests: it remembers applied operation ids like the real
// server, and each failure can be switched on.
import type { AttachmentUploadResponse } from '@shared/schemas/checks'
import type { PullResponse, PushRequest, PushResponse } from '@shared/schemas/sync'
import type { ApiError } from '@/api/errors'
import type { SyncApi, UploadFields } from '@/api/sync'

const empty = { sites: [], cameras: [], tasks: [], cameraModels: [], rounds: [], workOrders: [] }
export const noRemoved = {
  sites: [],
  cameras: [],
  tasks: [],
  cameraModels: [],
  rounds: [],
  workOrders: [],
}
export function page(over: Partial<PullResponse>): PullResponse {
  return {
    cursor: 0,
    hasMore: false,
    full: false,
    serverTime: new Date().toISOString(),
    ...empty,
    removed: noRemoved,
    ...over,
  }
}

/** A server stand-in that remembers applied operation ids like the real one. */
export function fakeServer() {
  const applied = new Set<string>()
  const state = {
    pushes: [] as PushRequest[],
    uploads: [] as { checkId: string; fields: UploadFields }[],
    pushError: null as ApiError | null,
    uploadError: null as ApiError | null,
    reject: new Map<string, { code: string; reason: string }>(),
    pages: [] as PullResponse[],
    pulls: [] as number[],
  }
  const api: SyncApi = {
    async push(body): Promise<PushResponse> {
      state.pushes.push(body)
      if (state.pushError) throw state.pushError
      return {
        serverTime: new Date().toISOString(),
        results: body.ops.map((op) => {
          const no = state.reject.get(op.id)
          if (no) return { id: op.id, status: 'rejected' as const, ...no }
          const dup = applied.has(op.id)
          applied.add(op.id)
          return { id: op.id, status: dup ? ('duplicate' as const) : ('applied' as const) }
        }),
      }
    },
    async pull(cursor) {
      state.pulls.push(cursor)
      return state.pages.shift() ?? page({ cursor })
    },
    async upload(checkId, _file, _name, fields): Promise<AttachmentUploadResponse> {
      if (state.uploadError) throw state.uploadError
      state.uploads.push({
        checkId,
        fields: {
          kind: fields.kind,
          measurementId: fields.measurementId,
          encoding: fields.encoding,
        },
      })
      return {
        duplicate: false,
        remeasure: [],
        attachment: {
          id: crypto.randomUUID(),
          checkId,
          measurementId: fields.measurementId,
          kind: fields.kind,
          sha256: 'a'.repeat(64),
          bytes: 4,
          mime: 'image/png',
          width: 4,
          height: 4,
          deleteAfter: null,
          createdAt: new Date().toISOString(),
        },
      }
    },
  }
  return { api, state, applied }
}
