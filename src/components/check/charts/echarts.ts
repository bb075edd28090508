// The parts of ECharts the app draws with (line charts with marked lines and areas), registered
// once; importing only these keeps the bundle small.
import { LineChart, ScatterChart } from 'echarts/charts'
import {
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TooltipComponent,
} from 'echarts/components'
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import VChart from 'vue-echarts'

use([
  LineChart,
  ScatterChart,
  GridComponent,
  LegendComponent,
  MarkAreaComponent,
  MarkLineComponent,
  MarkPointComponent,
  TooltipComponent,
  CanvasRenderer,
])

export { VChart }

/** Chart colours that read in sunlight and without colour (each series also has a name/label). */
export const CHART_COLOURS = {
  ink: '#13201f',
  muted: '#5c6b6a',
  grid: '#c9d4d2',
  series: ['#0f3d3e', '#c2410c', '#2563eb', '#7c3aed', '#0e7490', '#a16207'],
  threshold: '#b42318',
  baseline: '#17693a',
  nyquist: '#5c6b6a',
} as const
