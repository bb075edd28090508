// Chart options as pure functions of the numbers (testable without a browser).
import { CHART_COLOURS as C } from './echarts'

export interface MtfCurve {
  label: string
  points: readonly (readonly [number, number])[]
  /** Drawn thicker: the edge whose kernel the report shows. */
  emphasis?: boolean
}

const AXIS_TEXT = { color: C.ink, fontSize: 13 }

function vLine(
  x: number,
  label: string,
  colour: string,
  type: 'solid' | 'dashed' | 'dotted',
  raise = 0,
) {
  return {
    xAxis: x,
    label: {
      formatter: label,
      color: colour,
      fontSize: 12,
      fontWeight: 600,
      position: 'end' as const,
      distance: [0, 4 + raise],
    },
    lineStyle: { color: colour, type, width: 2 },
  }
}

/** MTF against frequency, with the median MTF50, the task minimum and Nyquist marked. */
export function mtfOption(
  curves: readonly MtfCurve[],
  marks: { medianMtf50CyPx: number | null; minMtf50CyPx: number | null },
) {
  // Short labels above the plot (the caption below gives the values); a second row when close.
  const lines = [vLine(0.5, 'Nyquist', C.nyquist, 'dotted')]
  const { medianMtf50CyPx: median, minMtf50CyPx: min } = marks
  if (median !== null) lines.push(vLine(median, 'MTF50', C.ink, 'solid'))
  if (min !== null) {
    const close = median !== null && Math.abs(min - median) < 0.12
    lines.push(vLine(min, 'min', C.threshold, 'dashed', close ? 16 : 0))
  }
  const maxY = Math.max(1.05, ...curves.flatMap((c) => c.points.map((p) => p[1])))
  return {
    animation: false,
    grid: { left: 44, right: 20, top: 44, bottom: 44 },
    tooltip: { trigger: 'axis' as const, valueFormatter: (v: unknown) => Number(v).toFixed(3) },
    xAxis: {
      type: 'value' as const,
      min: 0,
      max: 0.8,
      name: 'cycles/pixel',
      nameLocation: 'middle' as const,
      nameGap: 28,
      nameTextStyle: AXIS_TEXT,
      axisLabel: AXIS_TEXT,
      splitLine: { lineStyle: { color: C.grid } },
    },
    yAxis: {
      type: 'value' as const,
      min: 0,
      max: Math.ceil(maxY * 10) / 10,
      name: 'MTF',
      nameTextStyle: AXIS_TEXT,
      axisLabel: AXIS_TEXT,
      splitLine: { lineStyle: { color: C.grid } },
    },
    series: curves.map((c, i) => ({
      type: 'line' as const,
      name: c.label,
      data: c.points.filter((p) => p[0] <= 0.8).map((p) => [p[0], p[1]]),
      showSymbol: false,
      lineStyle: { width: c.emphasis ? 3 : 1.5, color: C.series[i % C.series.length] },
      itemStyle: { color: C.series[i % C.series.length] },
      ...(i === 0
        ? {
            markLine: {
              silent: true,
              symbol: 'none',
              data: [
                ...lines,
                {
                  yAxis: 0.5,
                  label: { show: false },
                  lineStyle: { color: C.muted, type: 'dotted' as const },
                },
              ],
            },
            markArea: {
              silent: true,
              itemStyle: { color: 'rgba(92,107,106,0.12)' },
              data: [[{ xAxis: 0.5 }, { xAxis: 0.8 }]],
            },
          }
        : {}),
    })),
  }
}

/** Edge spread (ESF) and line spread (LSF) against distance from the edge. */
export function profileOption(profile: {
  xPx: readonly number[]
  esf: readonly number[]
  lsf: readonly number[]
}) {
  const pairs = (ys: readonly number[]) => profile.xPx.map((x, i) => [x, ys[i]])
  return {
    animation: false,
    grid: { left: 44, right: 16, top: 36, bottom: 44 },
    legend: { top: 0, textStyle: AXIS_TEXT, data: ['Edge (ESF)', 'Line spread (LSF)'] },
    tooltip: { trigger: 'axis' as const, valueFormatter: (v: unknown) => Number(v).toFixed(3) },
    xAxis: {
      type: 'value' as const,
      name: 'px from the edge',
      nameLocation: 'middle' as const,
      nameGap: 28,
      nameTextStyle: AXIS_TEXT,
      axisLabel: AXIS_TEXT,
      splitLine: { lineStyle: { color: C.grid } },
    },
    yAxis: {
      type: 'value' as const,
      min: -0.2,
      max: 1.2,
      axisLabel: AXIS_TEXT,
      splitLine: { lineStyle: { color: C.grid } },
    },
    series: [
      {
        type: 'line' as const,
        name: 'Edge (ESF)',
        data: pairs(profile.esf),
        showSymbol: false,
        lineStyle: { width: 2.5, color: C.series[0] },
        itemStyle: { color: C.series[0] },
      },
      {
        type: 'line' as const,
        name: 'Line spread (LSF)',
        data: pairs(profile.lsf),
        showSymbol: false,
        lineStyle: { width: 2, type: 'dashed' as const, color: C.series[1] },
        itemStyle: { color: C.series[1] },
      },
    ],
  }
}
