/**
 * Exporting the drawing: the canvas SVG as a standalone file and as a PNG (browser only, through
 * an <img> and a <canvas>), and the document as JSON.
 */

/**
 * A standalone SVG text from the canvas element (namespace and a white background added); the
 * children of `under` (the canvas's back layer) are drawn first.
 */
export function standaloneSvg(svg: SVGSVGElement, under?: SVGSVGElement | null): string {
  const copy = svg.cloneNode(true) as SVGSVGElement
  if (under) for (const child of [...under.childNodes].reverse()) copy.insertBefore(child.cloneNode(true), copy.firstChild)
  copy.setAttribute('xmlns', 'http://www.w3.org/2000/svg')
  copy.setAttribute('width', String(svg.clientWidth))
  copy.setAttribute('height', String(svg.clientHeight))
  copy.querySelectorAll('[data-export="skip"]').forEach(n => n.remove())
  const bg = document.createElementNS('http://www.w3.org/2000/svg', 'rect')
  bg.setAttribute('width', '100%'); bg.setAttribute('height', '100%'); bg.setAttribute('fill', '#ffffff')
  copy.insertBefore(bg, copy.firstChild)
  return new XMLSerializer().serializeToString(copy)
}

/** Offer `data` as a download called `name`. */
export function downloadBlob(data: Blob, name: string): void {
  const url = URL.createObjectURL(data)
  const a = document.createElement('a')
  a.href = url; a.download = name
  document.body.appendChild(a); a.click(); a.remove()
  setTimeout(() => URL.revokeObjectURL(url), 1000)
}

/** Render an SVG text to a PNG blob at `pixelRatio` times its size (default 2). */
export async function svgToPng(svgText: string, width: number, height: number, pixelRatio = 2): Promise<Blob> {
  const img = new Image()
  img.src = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(svgText)}`
  await img.decode()
  const canvas = document.createElement('canvas')
  canvas.width = Math.round(width * pixelRatio); canvas.height = Math.round(height * pixelRatio)
  const ctx = canvas.getContext('2d')!
  ctx.scale(pixelRatio, pixelRatio)
  ctx.drawImage(img, 0, 0, width, height)
  return await new Promise((resolve, reject) => canvas.toBlob(b => (b ? resolve(b) : reject(new Error('PNG export failed'))), 'image/png'))
}

/** A file name from a pattern name: lower case, dashes, the pattern extension. */
export function patternFileName(name: string, extension: string): string {
  return `${name.trim().toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'pattern'}${extension}`
}

/** The name a blank pattern starts with (the workbench store's default). */
export const UNTITLED_PATTERN = 'Untitled pattern'

/**
 * Name of a pattern opened from a file: the document's own name, or the file's name without its
 * extension when the document carries only the blank placeholder ("my-ring.wfp.json" → "my-ring").
 */
export function openedPatternName(docName: string, fileName: string): string {
  const own = docName.trim()
  if (own && own !== UNTITLED_PATTERN) return own
  const base = fileName.replace(/\.wfp\.json$|\.json$/i, '').trim()
  return base || own || UNTITLED_PATTERN
}
