import { describe, expect, it } from 'vitest'
import { describeOp } from '../describeOp'

const names = (id: number) => (id === 3 ? 'MTD-003' : null)
const createdAt = '2025-05-02T10:00:00.000Z'

describe('describing queued operations in plain words', () => {
  it('names the camera, the mode and the verdict of a check', () => {
    const d = describeOp(
      {
        kind: 'check.create',
        payload: { cameraId: 3, mode: 'night', verdict: 'fail', capturedAt: createdAt },
        createdAt,
      },
      names,
    )
    expect(d.title).toBe('MTD-003: night check (fail)')
    expect(d.detail).toMatch(/^Captured .+, queued /)
  })

  it('falls back to the camera id when the device does not know the camera', () => {
    const d = describeOp(
      { kind: 'check.markBaseline', payload: { cameraId: 9, checkId: 'x' }, createdAt },
      names,
    )
    expect(d.title).toBe('camera 9: set as baseline')
  })

  it('describes work-order actions and unknown kinds', () => {
    expect(
      describeOp(
        {
          kind: 'workOrder.action',
          payload: { workOrderId: 12, action: 'ask_recheck' },
          createdAt,
        },
        names,
      ).title,
    ).toBe('Work order 12: ask recheck')
    expect(describeOp({ kind: 'thing.do', payload: null, createdAt }, names).title).toBe('thing.do')
  })
})
