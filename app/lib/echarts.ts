/**
 * The ECharts parts Wingfold draws (tree-shaken: canvas renderer, line / scatter / bar series,
 * grid, tooltip, legend, data zoom, mark lines and points for special points; custom series and
 * the visual map for the moduli maps) and vue-echarts' component. Imported only through the
 * async <VChart> of app/plugins/echarts.client.ts, so it is a chunk of its own that pages without
 * a chart never download.
 */
import { use } from 'echarts/core'
import { CanvasRenderer } from 'echarts/renderers'
import { BarChart, CustomChart, LineChart, ScatterChart } from 'echarts/charts'
import { DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent } from 'echarts/components'
import VChart from 'vue-echarts'

use([CanvasRenderer, BarChart, CustomChart, LineChart, ScatterChart, DataZoomComponent, GridComponent, LegendComponent, MarkLineComponent, MarkPointComponent, TooltipComponent, VisualMapComponent])

export default VChart
