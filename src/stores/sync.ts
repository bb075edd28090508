// The sync state the screens show — online, pending and rejected operations, files waiting,
// last sync, errors — and `syncNow()`. The engine (composables/useSyncEngine.ts) does the work;
// this store decides when: at start, when the network returns, on a timer, after a save.
import { liveQuery, type Subscription } from 'dexie'
import { defineStore } from 'pinia'
import { computed, ref, watch } from 'vue'
import { syncApi } from '@/api/sync'
import { useOnline } from '@/composables/useOnline'
import { createSyncEngine, type SyncError, type SyncReport } from '@/composables/useSyncEngine'
import { installSyncTriggers, registerBackgroundSync } from '@/composables/useSyncTriggers'
import { db } from '@/db/database'
import { listOutbox, retryRejected, setOutboxUser, type OutboxRecord } from '@/db/outbox'
import { retryRejectedUploads, type UploadRecord } from '@/db/outboxUploads'
import { SYNC_META_KEYS } from '@/db/syncCache'
import { useAuthStore } from './auth'
import { useCamerasStore } from './cameras'

/** A new operation is sent this long after it was queued (several saves go in one push). */
const AFTER_SAVE_MS = 1_500

export const useSyncStore = defineStore('sync', () => {
  const auth = useAuthStore()
  const cameras = useCamerasStore()
  const { online } = useOnline()

  const queue = ref<OutboxRecord[]>([])
  const uploads = ref<UploadRecord[]>([])
  const syncing = ref(false)
  const lastSyncAt = ref<string | null>(null)
  const error = ref<SyncError | null>(null)
  const lastReport = ref<SyncReport | null>(null)

  const pending = computed(() => queue.value.filter((op) => op.status !== 'rejected'))
  const pendingCount = computed(() => pending.value.length)
  const rejected = computed(() => queue.value.filter((op) => op.status === 'rejected'))
  const uploadsPending = computed(() => uploads.value.filter((u) => u.status !== 'rejected'))
  const uploadsRejected = computed(() => uploads.value.filter((u) => u.status === 'rejected'))

  setOutboxUser(() => auth.user?.id ?? null)

  const engine = createSyncEngine({
    db,
    api: syncApi,
    userId: () => auth.user?.id ?? null,
    async onPulled() {
      if (cameras.loaded) await cameras.loadCached()
    },
  })

  let running: Promise<SyncReport | null> | null = null
  let rerun: boolean | null = null
  let timer: ReturnType<typeof setTimeout> | null = null
  let removeTriggers: (() => void) | null = null
  let subscriptions: Subscription[] = []
  let lastSeq = 0
  let started = false

  async function readLastSync(): Promise<void> {
    lastSyncAt.value = (await db.meta.get(SYNC_META_KEYS.lastSyncAt))?.value ?? null
  }

  /** Runs one sync (or joins the one running; a forced request runs again right after it). */
  function syncNow(force = true): Promise<SyncReport | null> {
    if (!auth.user) return Promise.resolve(null)
    if (running) {
      rerun = (rerun ?? false) || force
      return running
    }
    syncing.value = true
    running = engine
      .run({ force })
      .then(async (report) => {
        lastReport.value = report
        error.value = report.offline ? null : report.error
        await readLastSync()
        if (report.offline && pendingCount.value > 0) void registerBackgroundSync()
        return report
      })
      .catch((e: unknown) => {
        error.value = { code: 'unknown', message: e instanceof Error ? e.message : String(e) }
        return null
      })
      .finally(() => {
        running = null
        syncing.value = false
        if (rerun !== null) {
          const force2 = rerun
          rerun = null
          void syncNow(force2)
        }
      })
    return running
  }

  function soon(): void {
    if (timer) clearTimeout(timer)
    timer = setTimeout(() => {
      timer = null
      if (online.value) void syncNow(false)
      else void registerBackgroundSync()
    }, AFTER_SAVE_MS)
  }

  function watchQueue(userId: number | null): void {
    for (const s of subscriptions) s.unsubscribe()
    subscriptions = []
    queue.value = []
    uploads.value = []
    if (userId === null) return
    subscriptions.push(
      liveQuery(() => listOutbox(db, userId)).subscribe((list) => {
        queue.value = list
        // Something new was queued (a save on this device): send it shortly.
        const newest = list.reduce((m, op) => Math.max(m, op.seq ?? 0), 0)
        if (newest > lastSeq && started) soon()
        lastSeq = Math.max(lastSeq, newest)
      }),
      liveQuery(() => db.uploads.filter((u) => u.userId === userId).toArray()).subscribe((list) => {
        uploads.value = list
      }),
    )
  }

  /** Starts watching the queue and the triggers; safe to call more than once. */
  function start(): void {
    if (started) return
    started = true
    void readLastSync()
    watchQueue(auth.user?.id ?? null)
    removeTriggers = installSyncTriggers({
      run: (force) => void syncNow(force),
      isOnline: () => online.value,
    })
    if (online.value) void syncNow(false)
  }

  function stop(): void {
    started = false
    removeTriggers?.()
    removeTriggers = null
    if (timer) clearTimeout(timer)
    for (const s of subscriptions) s.unsubscribe()
    subscriptions = []
  }

  /** Sends one rejected operation (or all of them, and rejected uploads) again now. */
  async function retry(id?: string): Promise<void> {
    const userId = auth.user?.id
    if (userId === undefined) return
    await retryRejected(db, userId, id)
    if (id === undefined) await retryRejectedUploads(db, userId)
    if (online.value) await syncNow(true)
  }

  watch(
    () => auth.user?.id ?? null,
    (userId, before) => {
      if (userId === before) return
      lastSeq = 0
      error.value = null
      lastReport.value = null
      if (started) {
        watchQueue(userId)
        if (userId !== null && online.value) void syncNow(false)
      }
    },
  )

  return {
    online,
    queue,
    uploads,
    pending,
    pendingCount,
    rejected,
    uploadsPending,
    uploadsRejected,
    syncing,
    lastSyncAt,
    error,
    lastReport,
    syncNow,
    retry,
    start,
    stop,
  }
})
