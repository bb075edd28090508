// Fleet overview use cases (supervisor; admin may read).
import type { FleetCameraQuery, FleetFilter } from '../../../shared/schemas/fleet'
import type { Db } from '../../db/client'
import { fleetCameraPage } from './cameraTable'
import { cameraHistory, checkDetail } from './history'
import { fleetSummary } from './summary'
import { mtfDistribution, passRateTrend } from './trends'
import { registerFleetWeeksHook } from './weeks'

export function createFleetService(db: Db, now: () => Date) {
  // Recorded checks keep the weekly chart aggregates up to date.
  registerFleetWeeksHook()
  return {
    summary: (f: FleetFilter) => fleetSummary(db, f, now()),
    cameras: (q: FleetCameraQuery) => fleetCameraPage(db, q, now()),
    history: (cameraId: number, limit: number) => cameraHistory(db, cameraId, limit, now()),
    check: (checkId: string) => checkDetail(db, checkId),
    passRate: (f: FleetFilter & { sites: number }) => passRateTrend(db, f, now()),
    mtfDistribution: (f: FleetFilter) => mtfDistribution(db, f, now()),
  }
}

export type FleetService = ReturnType<typeof createFleetService>
