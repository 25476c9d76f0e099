/**
 * How special points are drawn on the branch diagram: one marker shape and colour per kind
 * (Wingfold's own choice), plain-word kinds only. Unknown kinds get a neutral marker.
 */

/** Marker of one kind: an ECharts symbol name and a colour. */
export interface MarkerStyle { symbol: string, color: string, size: number }

export const SPECIAL_MARKERS: Record<string, MarkerStyle> = {
  'fold': { symbol: 'triangle', color: '#c2410c', size: 14 },
  'branch point': { symbol: 'diamond', color: '#6d28d9', size: 15 },
  'rigidity loss': { symbol: 'rect', color: '#be185d', size: 12 },
  'collapse': { symbol: 'pin', color: '#b91c1c', size: 22 },
  'order flip': { symbol: 'arrow', color: '#1d4ed8', size: 14 },
  'lattice degeneracy': { symbol: 'roundRect', color: '#15803d', size: 12 },
  'bound': { symbol: 'emptyCircle', color: '#475569', size: 11 },
  'milestone': { symbol: 'circle', color: '#ca8a04', size: 9 },
  'closed loop': { symbol: 'emptyDiamond', color: '#0f766e', size: 14 },
}

const FALLBACK: MarkerStyle = { symbol: 'emptyRect', color: '#334155', size: 12 }

/** The marker of a special point kind. */
export function markerFor(kind: string): MarkerStyle {
  return SPECIAL_MARKERS[kind] ?? FALLBACK
}

/** Line colours of the runs on one diagram (in order). */
export const RUN_COLOURS = ['#0f4c81', '#d97706', '#0e7490', '#7c3aed', '#65a30d', '#db2777', '#475569', '#a16207']
