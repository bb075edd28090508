export type {
  Severity,
  TaskId,
  Verdict,
  VerdictEdge,
  VerdictInput,
  VerdictReason,
  VerdictThresholds,
  VerdictValue,
} from './types'
export { COMMON_THRESHOLDS, TASK_DEFAULTS, thresholdsFor, type TaskDefaults } from './tasks'
export { evaluateVerdict, type VerdictOptions } from './evaluate'
export { hazeEvidence, type HazeEvidence } from './haze'
export { median } from './median'
