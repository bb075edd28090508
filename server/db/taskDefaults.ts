import type { Priority } from '../../shared/schemas/enums'

export interface TaskDefault {
  id: string
  name: string
  description: string
  requiredPxPerM: number
  minMtf50CyPx: number
  checkIntervalDays: number
  workOrderPriority: Priority
  workOrderDueDays: number
}

// Required pixel densities are the IEC 62676-4:2014 levels [std] (monitor 12.5, detect 25,
// observe 62.5, recognise 125, identify 250, inspect 1000 px/m). Plate reading at 250 px/m is
// common practice (characters of about 15 px and more) [practice]; process inspection reuses the
// inspect level [ours]. MTF50 minimums (cycles/pixel) follow the usual reading of JPEG snapshots
// from fixed IP cameras — 0.25–0.35 sharp, 0.15–0.20 soft — and are common practice, not a
// standard [practice]. Intervals, priorities and due days are our starting values [ours].
// Marginal band 10 %, drift 0.8 / 0.6 and night/day 0.8 are the column defaults in schema.ts.
export const TASK_DEFAULTS: readonly TaskDefault[] = [
  {
    id: 'monitor',
    name: 'Monitor',
    description: 'See the flow of people or traffic over a wide area.',
    requiredPxPerM: 12.5,
    minMtf50CyPx: 0.15,
    checkIntervalDays: 180,
    workOrderPriority: 'low',
    workOrderDueDays: 30,
  },
  {
    id: 'detect',
    name: 'Detect',
    description: 'Tell reliably whether a person is present.',
    requiredPxPerM: 25,
    minMtf50CyPx: 0.15,
    checkIntervalDays: 180,
    workOrderPriority: 'low',
    workOrderDueDays: 30,
  },
  {
    id: 'observe',
    name: 'Observe',
    description: 'See what a person is doing: clothing, actions, surroundings.',
    requiredPxPerM: 62.5,
    minMtf50CyPx: 0.18,
    checkIntervalDays: 120,
    workOrderPriority: 'normal',
    workOrderDueDays: 14,
  },
  {
    id: 'recognise',
    name: 'Recognise',
    description: 'Tell whether a person is someone seen before.',
    requiredPxPerM: 125,
    minMtf50CyPx: 0.2,
    checkIntervalDays: 90,
    workOrderPriority: 'normal',
    workOrderDueDays: 14,
  },
  {
    id: 'identify',
    name: 'Identify',
    description: 'Identify a person beyond reasonable doubt.',
    requiredPxPerM: 250,
    minMtf50CyPx: 0.22,
    checkIntervalDays: 90,
    workOrderPriority: 'high',
    workOrderDueDays: 7,
  },
  {
    id: 'inspect',
    name: 'Inspect',
    description: 'Examine an object or document in fine detail.',
    requiredPxPerM: 1000,
    minMtf50CyPx: 0.25,
    checkIntervalDays: 60,
    workOrderPriority: 'high',
    workOrderDueDays: 7,
  },
  {
    id: 'plate_reading',
    name: 'Plate reading',
    description: 'Read number plates of passing vehicles.',
    requiredPxPerM: 250,
    minMtf50CyPx: 0.22,
    checkIntervalDays: 60,
    workOrderPriority: 'high',
    workOrderDueDays: 5,
  },
  {
    id: 'process_inspection',
    name: 'Process inspection',
    description: 'Check products on a production line (fill level, caps, labels).',
    requiredPxPerM: 1000,
    minMtf50CyPx: 0.25,
    checkIntervalDays: 30,
    workOrderPriority: 'urgent',
    workOrderDueDays: 2,
  },
]
