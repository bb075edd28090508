// Words for states, verdicts and sort orders in the fleet screens.
import type { CameraState, Verdict } from '@shared/schemas/enums'
import type { FleetSort } from '@shared/schemas/fleet'

export const STATE_LABEL: Record<CameraState, string> = {
  ok: 'OK',
  due: 'Due',
  failing: 'Failing',
  in_repair: 'In repair',
}

export const VERDICT_LABEL: Record<Verdict, string> = {
  pass: 'Pass',
  marginal: 'Marginal',
  fail: 'Fail',
}

export const SORT_LABEL: Record<FleetSort, string> = {
  assetTag: 'Asset tag',
  site: 'Site',
  task: 'Task',
  model: 'Camera model',
  state: 'State',
  lastCheckAt: 'Last check',
  nextDueAt: 'Next check due',
  lastMtf50CyPx: 'Last MTF50',
}

export const pct = (r: number | null | undefined) =>
  r === null || r === undefined ? '—' : `${Math.round(r * 100)} %`
