import { describe, expect, it } from 'vitest'
import { trendOption } from '@/components/camera/trendOption'
import { mtfOption, profileOption } from '../charts/options'

describe('chart options', () => {
  it('marks Nyquist, the median MTF50 and the task minimum on the MTF chart, and shades above Nyquist', () => {
    const o = mtfOption(
      [
        {
          label: 'Edge 1',
          points: [
            [0, 1],
            [0.1, 0.6],
            [0.2, 0.3],
            [0.9, 0],
          ],
        },
        {
          label: 'Edge 2',
          points: [
            [0, 1],
            [0.2, 0.4],
          ],
          emphasis: true,
        },
      ],
      { medianMtf50CyPx: 0.12, minMtf50CyPx: 0.18 },
    )
    const first = o.series[0] as unknown as {
      data: unknown[]

      markLine: { data: { xAxis?: number; yAxis?: number }[] }
      markArea: { data: unknown }
    }
    expect(first.markLine.data.map((d) => d.xAxis ?? `y${d.yAxis}`)).toEqual([
      0.5,
      0.12,
      0.18,
      'y0.5',
    ])
    expect(first.markArea.data).toEqual([[{ xAxis: 0.5 }, { xAxis: 0.8 }]])
    expect(first.data).toHaveLength(3)
    expect(o.series[1].lineStyle.width).toBeGreaterThan(o.series[0].lineStyle.width)
  })

  it('draws the edge and line spread against distance from the edge', () => {
    const o = profileOption({ xPx: [-1, 0, 1], esf: [0, 0.5, 1], lsf: [0.5, 1, 0.5] })
    expect(o.series.map((s) => s.data)).toEqual([
      [
        [-1, 0],
        [0, 0.5],
        [1, 1],
      ],
      [
        [-1, 0.5],
        [0, 1],
        [1, 0.5],
      ],
    ])
  })

  it('draws the trend by mode, with a symbol per verdict and the minimum and baseline lines', () => {
    const o = trendOption(
      [
        { capturedAt: '2025-03-01T00:00:00Z', mtf50CyPx: 0.3, verdict: 'pass', mode: 'day' },
        { capturedAt: '2025-01-01T00:00:00Z', mtf50CyPx: 0.19, verdict: 'marginal', mode: 'day' },
        { capturedAt: '2025-02-01T00:00:00Z', mtf50CyPx: 0.1, verdict: 'fail', mode: 'night' },
      ],
      0.2,
      0.31,
    )
    expect(o.series).toHaveLength(2)
    const day = o.series[0] as unknown as {
      data: { value: [string, number]; symbol: string }[]
      markLine: { data: { yAxis: number }[] }
    }
    expect(day.data.map((d) => [d.value[1], d.symbol])).toEqual([
      [0.19, 'triangle'],
      [0.3, 'circle'],
    ])
    expect(day.markLine.data.map((d) => d.yAxis)).toEqual([0.2, 0.31])
    expect((o.series[1] as { data: { symbol: string }[] }).data[0].symbol).toBe('rect')
  })
})
