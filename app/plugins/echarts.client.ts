/**
 * ECharts through vue-echarts, registered globally as <VChart> on the client only, with just
 * the parts Wingfold draws (tree-shaken: canvas renderer, line / scatter / bar series, grid,
 * tooltip, legend, data zoom, mark lines and points for special points; custom series and the
 * visual map for the moduli maps).
 */
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import { BarChart, CustomChart, LineChart, ScatterChart } from 'echarts/charts'
import { DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent } from 'echarts/components'
import VChart from 'vue-echarts'

export default defineNuxtPlugin((nuxtApp) => {
  use([CanvasRenderer, BarChart, CustomChart, LineChart, ScatterChart, DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent])
  nuxtApp.vueApp.component('VChart', VChart)
})
