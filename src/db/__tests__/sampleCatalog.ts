// Small invented catalogue for tests: two sites, three cameras, one task.
import type { Camera } from '@shared/schemas/cameras'
import type { Task } from '@shared/schemas/catalog'
import type { Site } from '@shared/schemas/sites'

const T0 = '2025-03-01T08:00:00.000Z'

export function sampleSite(id: number, name: string): Site {
  return { id, name, address: `${id} Test Road`, timeZone: 'UTC', cameraCount: 1, updatedAt: T0 }
}

export function sampleTask(id = 'observe'): Task {
  return {
    id,
    name: 'Observe',
    description: 'See what people are doing.',
    requiredPxPerM: 62.5,
    minMtf50CyPx: 0.2,
    marginalBand: 0.1,
    driftWarnRatio: 0.8,
    driftFailRatio: 0.6,
    nightDayWarnRatio: 0.8,
    checkIntervalDays: 90,
    workOrderPriority: 'normal',
    workOrderDueDays: 14,
    version: 1,
    updatedAt: T0,
  }
}

export function sampleCamera(id: number, overrides: Partial<Camera> = {}): Camera {
  return {
    id,
    assetTag: `CAM-${String(id).padStart(3, '0')}`,
    siteId: 1,
    siteName: 'North Depot',
    locationText: `Gate ${id}`,
    cameraModelId: 1,
    cameraModelName: 'Test Bullet 4MP',
    taskId: 'observe',
    taskName: 'Observe',
    requiredPxPerM: 62.5,
    minMtf50CyPx: 0.2,
    checkIntervalDays: 90,
    overrides: { requiredPxPerM: null, minMtf50CyPx: null, checkIntervalDays: null },
    focalLengthMm: 4,
    targetDistanceM: 10,
    baselineCheckId: null,
    baselineMtf50CyPx: null,
    state: 'ok',
    lastCheckId: null,
    lastCheckAt: null,
    lastVerdict: null,
    lastMtf50CyPx: null,
    nextDueAt: '2025-06-01T00:00:00.000Z',
    overdue: false,
    active: true,
    version: 1,
    updatedAt: T0,
    ...overrides,
  }
}
