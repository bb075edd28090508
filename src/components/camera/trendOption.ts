// The camera's MTF50 over time with the task minimum and the baseline drawn as lines.
// A pure function of the numbers (testable without a browser).
import { CHART_COLOURS as C } from '@/components/check/charts/echarts'
import type { Verdict } from '@shared/schemas/enums'

export interface TrendPoint {
  capturedAt: string
  mtf50CyPx: number
  verdict: Verdict
  mode: 'day' | 'night'
}

const VERDICT_COLOUR: Record<Verdict, string> = {
  pass: '#17693a',
  marginal: '#8a5300',
  fail: '#b42318',
}
/** Each verdict also has its own symbol, so the chart reads without colour. */
const VERDICT_SYMBOL: Record<Verdict, string> = {
  pass: 'circle',
  marginal: 'triangle',
  fail: 'rect',
}

export function trendOption(
  points: readonly TrendPoint[],
  minMtf50CyPx: number,
  baselineMtf50CyPx: number | null,
) {
  const sorted = [...points].sort((a, b) => a.capturedAt.localeCompare(b.capturedAt))
  const series = (mode: 'day' | 'night') => ({
    type: 'line' as const,
    name: mode === 'day' ? 'Day' : 'Infrared night',
    data: sorted
      .filter((p) => p.mode === mode)
      .map((p) => ({
        value: [p.capturedAt, p.mtf50CyPx],
        symbol: VERDICT_SYMBOL[p.verdict],
        symbolSize: 11,
        itemStyle: { color: VERDICT_COLOUR[p.verdict], borderColor: '#fff', borderWidth: 1 },
      })),
    lineStyle: {
      color: mode === 'day' ? C.series[0] : C.series[3],
      width: 2,
      type: mode === 'day' ? ('solid' as const) : ('dashed' as const),
    },
    itemStyle: { color: mode === 'day' ? C.series[0] : C.series[3] },
  })
  const lines: object[] = [
    {
      yAxis: minMtf50CyPx,
      label: {
        formatter: `Task min ${minMtf50CyPx.toFixed(2)}`,
        position: 'insideStartTop',
        color: C.threshold,
        fontWeight: 600,
      },
      lineStyle: { color: C.threshold, type: 'dashed', width: 2 },
    },
  ]
  if (baselineMtf50CyPx !== null) {
    lines.push({
      yAxis: baselineMtf50CyPx,
      label: {
        formatter: `Baseline ${baselineMtf50CyPx.toFixed(2)}`,
        position: 'insideEndTop',
        color: C.baseline,
        fontWeight: 600,
      },
      lineStyle: { color: C.baseline, type: 'solid', width: 2 },
    })
  }
  const values = [...sorted.map((p) => p.mtf50CyPx), minMtf50CyPx, baselineMtf50CyPx ?? 0]
  const day = series('day')
  const night = series('night')
  const withMarks = { ...day, markLine: { silent: true, symbol: 'none', data: lines } }
  return {
    animation: false,
    grid: { left: 48, right: 16, top: 36, bottom: 40 },
    legend: { top: 0, textStyle: { color: C.ink, fontSize: 13 } },
    tooltip: { trigger: 'item' as const },
    xAxis: { type: 'time' as const, axisLabel: { color: C.ink, fontSize: 12, hideOverlap: true } },
    yAxis: {
      type: 'value' as const,
      min: 0,
      max: Math.ceil(Math.max(...values) * 12) / 10,
      name: 'MTF50 (c/p)',
      nameTextStyle: { color: C.ink, fontSize: 13 },
      axisLabel: { color: C.ink, fontSize: 12 },
      splitLine: { lineStyle: { color: C.grid } },
    },
    series: night.data.length ? [withMarks, night] : [withMarks],
  }
}
