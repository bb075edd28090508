// The fleet overview: the chosen period and filters, and what the server counted for them.
import { defineStore } from 'pinia'
import { computed, ref } from 'vue'
import { ApiError, errorMessage } from '@/api/errors'
import {
  fetchDistribution,
  fetchPassRate,
  fetchSummary,
  type FleetSummary,
  type MtfDistribution,
  type PassRateTrend,
} from '@/api/fleet'
import type { Query } from '@/api/http'
import type { StoreError } from './auth'

export const PERIODS = [
  { days: 30, label: '30 days' },
  { days: 90, label: '90 days' },
  { days: 365, label: '12 months' },
] as const

export interface FleetFilters {
  periodDays: number
  siteId?: number
  taskId?: string
  cameraModelId?: number
}

const DAY_MS = 86_400_000

export const useFleetStore = defineStore('fleet', () => {
  const filters = ref<FleetFilters>({ periodDays: 90 })
  const summary = ref<FleetSummary | null>(null)
  const passRate = ref<PassRateTrend | null>(null)
  const distribution = ref<MtfDistribution | null>(null)
  const loading = ref(false)
  const error = ref<StoreError | null>(null)
  let controller: AbortController | null = null

  /** The filters as the API's query (the period ends now). */
  const query = computed<Query>(() => ({
    from: new Date(Date.now() - filters.value.periodDays * DAY_MS).toISOString(),
    siteId: filters.value.siteId,
    taskId: filters.value.taskId,
    cameraModelId: filters.value.cameraModelId,
  }))

  async function load(): Promise<void> {
    controller?.abort()
    const ac = (controller = new AbortController())
    loading.value = true
    error.value = null
    const q = query.value
    try {
      const [s, p, d] = await Promise.all([
        fetchSummary(q, ac.signal),
        fetchPassRate(q, ac.signal),
        fetchDistribution(q, ac.signal),
      ])
      summary.value = s
      passRate.value = p
      distribution.value = d
    } catch (e) {
      if (e instanceof DOMException && e.name === 'AbortError') return
      error.value = { code: e instanceof ApiError ? e.code : 'unknown', message: errorMessage(e) }
    } finally {
      if (controller === ac) loading.value = false
    }
  }

  function setFilters(next: Partial<FleetFilters>): Promise<void> {
    filters.value = { ...filters.value, ...next }
    return load()
  }

  return { filters, summary, passRate, distribution, loading, error, query, load, setFilters }
})
