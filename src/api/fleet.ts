// Fleet overview (supervisor; admin may read): counts, chart series, the camera table and a
// camera's history with its checks.
import {
  cameraHistorySchema,
  checkDetailSchema,
  fleetCameraPageSchema,
  fleetSummarySchema,
  mtfDistributionSchema,
  passRateTrendSchema,
  type CameraHistory,
  type CheckDetail,
  type FleetCameraPage,
  type FleetSummary,
  type MtfDistribution,
  type PassRateTrend,
} from '@shared/schemas/fleet'
import { http, type Query } from './http'

export type {
  CameraHistory,
  CheckDetail,
  FleetCameraPage,
  FleetSummary,
  MtfDistribution,
  PassRateTrend,
}

export const fetchSummary = (query: Query, signal?: AbortSignal): Promise<FleetSummary> =>
  http.get('/api/fleet/summary', { query, schema: fleetSummarySchema, signal })

export const fetchPassRate = (query: Query, signal?: AbortSignal): Promise<PassRateTrend> =>
  http.get('/api/fleet/trends/pass-rate', { query, schema: passRateTrendSchema, signal })

export const fetchDistribution = (query: Query, signal?: AbortSignal): Promise<MtfDistribution> =>
  http.get('/api/fleet/distribution/mtf50', { query, schema: mtfDistributionSchema, signal })

export const fetchCameraPage = (query: Query, signal?: AbortSignal): Promise<FleetCameraPage> =>
  http.get('/api/fleet/cameras', { query, schema: fleetCameraPageSchema, signal })

export const fetchHistory = (cameraId: number, signal?: AbortSignal): Promise<CameraHistory> =>
  http.get(`/api/fleet/cameras/${cameraId}/history`, { schema: cameraHistorySchema, signal })

export const fetchCheck = (checkId: string, signal?: AbortSignal): Promise<CheckDetail> =>
  http.get(`/api/fleet/checks/${encodeURIComponent(checkId)}`, {
    schema: checkDetailSchema,
    signal,
  })
