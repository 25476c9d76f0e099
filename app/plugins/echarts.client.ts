/**
 * ECharts through vue-echarts, registered globally as <VChart> on the client only, with just
 * the parts Wingfold draws (tree-shaken: canvas renderer, line / scatter / bar series, grid,
 * tooltip, legend, data zoom, mark lines and points for special points).
 */
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import { BarChart, LineChart, ScatterChart } from 'echarts/charts'
import { DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent } from 'echarts/components'
import VChart from 'vue-echarts'

export default defineNuxtPlugin((nuxtApp) => {
  use([CanvasRenderer, BarChart, LineChart, ScatterChart, DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent])
  nuxtApp.vueApp.component('VChart', VChart)
})
