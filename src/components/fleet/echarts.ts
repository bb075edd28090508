// The parts of echarts the fleet charts use, registered once (keeps the bundle small).
import { use } from 'echarts/core'
import { BarChart, LineChart, ScatterChart } from 'echarts/charts'
import {
  AriaComponent,
  DataZoomComponent,
  GridComponent,
  LegendComponent,
  MarkLineComponent,
  TooltipComponent,
} from 'echarts/components'
import { CanvasRenderer } from 'echarts/renderers'
import VChart from 'vue-echarts'

use([
  LineChart,
  BarChart,
  ScatterChart,
  GridComponent,
  TooltipComponent,
  LegendComponent,
  MarkLineComponent,
  DataZoomComponent,
  AriaComponent,
  CanvasRenderer,
])

export { VChart }

/** Line colours for series (site or model lines), chosen to stay apart in print and for common colour-vision differences. */
export const SERIES_COLOURS = [
  '#0f3d3e',
  '#c06a00',
  '#3f5fa8',
  '#7a3b69',
  '#4d7d2a',
  '#8c6d1f',
  '#5c6b6a',
  '#b0436e',
  '#2a7f8f',
]
export const VERDICT_COLOURS = { pass: '#17693a', marginal: '#8a5300', fail: '#b42318' } as const

export const baseChart = {
  aria: { enabled: true },
  textStyle: { fontFamily: 'Inter, system-ui, sans-serif', color: '#3a4a49' },
  animationDuration: 300,
}
