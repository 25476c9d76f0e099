/**
 * Diagram exports for papers: SVG rendered by ECharts' server-side SVG renderer (works in the
 * browser and in node) and PNG from a live chart, both on a white background with our font.
 */
import { init, use } from 'echarts/core'
import { SVGRenderer } from 'echarts/renderers'
import { LineChart, ScatterChart } from 'echarts/charts'
import { GridComponent, LegendComponent, TooltipComponent } from 'echarts/components'
import { RESULT_CAUTION } from '#shared/types/runs'
import { branchDiagramOption, DIAGRAM_FONT, type DiagramSpec } from './chart'

use([SVGRenderer, LineChart, ScatterChart, GridComponent, LegendComponent, TooltipComponent])

/** Export size in pixels. Default 900 × 560. */
export interface ExportSize { width?: number, height?: number }

/** The diagram as an SVG document; `note` (app version and settings) and the caution are written under the plot. */
export function diagramSvg(spec: DiagramSpec, note: string, size: ExportSize = {}): string {
  const width = size.width ?? 900, height = size.height ?? 560
  const chart = init(null as unknown as HTMLElement, undefined, { renderer: 'svg', ssr: true, width, height })
  const option = branchDiagramOption({ ...spec, animation: false })
  chart.setOption({
    ...option,
    grid: { ...option.grid, bottom: 96 },
  })
  let svg = chart.renderToSVGString()
  chart.dispose()
  const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;')
  const footer = `<text x="12" y="${height - 30}" font-family="${DIAGRAM_FONT}" font-size="11" fill="#4b5563">${esc(note)}</text>`
    + `<text x="12" y="${height - 12}" font-family="${DIAGRAM_FONT}" font-size="11" fill="#4b5563">${esc(RESULT_CAUTION)}</text>`
  svg = svg.replace(/<\/svg>\s*$/, `${footer}</svg>`)
  return svg
}
