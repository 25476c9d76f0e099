/**
 * ECharts option of the branch diagram: one line per run, special points as scatter series (one
 * per kind, so the legend explains the markers), axis names with units, our font, white
 * background. Pure: the live view, the compare page and the SVG export use the same builder.
 */
import { axisValue, specialAxisValue, type AxisKey, type DiagramPoint, type DiagramSpecial } from './axes'
import { markerFor, RUN_COLOURS } from './markers'

/** One run on the diagram. */
export interface DiagramRun { name: string, points: readonly DiagramPoint[], special: readonly DiagramSpecial[] }

/** What the diagram shows. */
export interface DiagramSpec {
  runs: readonly DiagramRun[]
  x: { key: AxisKey, title: string }
  y: { key: AxisKey, title: string }
  /** Whether to animate (off for exports and live growth). Default false. */
  animation?: boolean
}

/** The diagram's font (the app's font, self-hosted). */
export const DIAGRAM_FONT = 'Space Grotesk, system-ui, sans-serif'

/** Data of special point series: `[x, y, runIndex, specialIndex]`. */
export type SpecialDatum = [number, number, number, number]

/** The ECharts option for a {@link DiagramSpec}. */
export function branchDiagramOption(spec: DiagramSpec) {
  const lines = spec.runs.map((r, i) => ({
    name: r.name,
    type: 'line' as const,
    showSymbol: r.points.length < 60,
    symbolSize: 4,
    color: RUN_COLOURS[i % RUN_COLOURS.length],
    lineStyle: { width: 2 },
    data: r.points.map(p => [axisValue(p, spec.x.key), axisValue(p, spec.y.key), i, p.index]).filter(d => Number.isFinite(d[0]) && Number.isFinite(d[1])),
    z: 2,
  }))
  const byKind = new Map<string, SpecialDatum[]>()
  spec.runs.forEach((r, i) => {
    for (const s of r.special) {
      const x = specialAxisValue(s, r.points, spec.x.key)
      const y = specialAxisValue(s, r.points, spec.y.key)
      if (!Number.isFinite(x) || !Number.isFinite(y)) continue
      byKind.set(s.kind, [...(byKind.get(s.kind) ?? []), [x!, y!, i, s.index]])
    }
  })
  const specials = [...byKind].map(([kind, data]) => {
    const m = markerFor(kind)
    return { name: kind, type: 'scatter' as const, symbol: m.symbol, symbolSize: m.size, color: m.color, itemStyle: { color: m.color, borderColor: m.color, borderWidth: 1.5 }, data, z: 5 }
  })
  const axis = (title: string) => ({
    type: 'value' as const, name: title, nameLocation: 'middle' as const, nameGap: 34, scale: true,
    nameTextStyle: { fontFamily: DIAGRAM_FONT, fontSize: 13, color: '#1f2937' },
    axisLabel: { fontFamily: DIAGRAM_FONT, color: '#374151' },
    splitLine: { lineStyle: { color: '#e5e7eb' } },
  })
  return {
    animation: spec.animation ?? false,
    backgroundColor: '#ffffff',
    textStyle: { fontFamily: DIAGRAM_FONT },
    grid: { left: 72, right: 24, top: 48, bottom: 56 },
    legend: { top: 8, textStyle: { fontFamily: DIAGRAM_FONT }, data: [...lines.map(l => l.name), ...specials.map(s => s.name)] },
    tooltip: { trigger: 'item' as const },
    xAxis: axis(spec.x.title),
    yAxis: { ...axis(spec.y.title), nameGap: 52 },
    series: [...lines, ...specials],
  }
}
