/**
 * `wingfold certify FILE [--pattern PATTERN] [--json]`: interval certificates.
 * FILE a pattern document: the horizontal (torus) and phase certificates of its drawing and the
 * checklist of the existence theorem's hypotheses with the strength of each verdict.
 * FILE a run export (format 'wingfold-run'): a certificate for every saved point; the pattern
 * document the run was computed on is given with --pattern. Exit 0 when everything asked for is
 * certified, 1 otherwise, 2 on bad input.
 */
import { readFile } from 'node:fs/promises'
import { parseArgs } from 'node:util'
import { certifiedExistence, provenParts, STATUS_WORDS } from '../../shared/certify/checklist'
import { certifyFamilyPoints, certifyFamilySegments } from '../../shared/certify/family'
import { certifyDrawing, describeCertificate } from '../../shared/certify/pattern'
import { analyzePattern } from '../../shared/pattern/analyze'
import { compilePattern } from '../../shared/pattern/model'
import { RUN_EXPORT_FORMAT } from '../../shared/types/runs'
import { readPatternFile } from '../read-document'

export const summary = 'FILE [--pattern P] [--json] interval certificates of a pattern, or of every point of a run export (with its pattern)'

const NORMS = 'Radii in the max-norm of the unknowns: positions of all vertices but the first (lattice length units; plane drawings: the free coordinates and wing angles of the square reduction, length units and radians), or phases ψ of all vertices but the first of each component (radians), on the published level rows of vertical balance.'

async function readJson(file: string): Promise<unknown | { error: string }> {
  try { return JSON.parse(await readFile(file, 'utf8')) } catch (e) { return { error: `${file}: ${(e as Error).message}` } }
}

/** Runs the command; returns the exit code. */
export async function run(args: string[]): Promise<number> {
  let parsed
  try {
    parsed = parseArgs({ args, allowPositionals: true, options: { pattern: { type: 'string' }, json: { type: 'boolean', default: false } } })
  } catch (e) { console.error(`wingfold certify: ${(e as Error).message}`); return 2 }
  const file = parsed.positionals[0]
  if (!file || parsed.positionals.length > 1) { console.error(`usage: wingfold certify ${summary}`); return 2 }
  const json = await readJson(file)
  if (json && typeof json === 'object' && 'error' in json) { console.error((json as { error: string }).error); return 2 }
  if ((json as { format?: string })?.format === RUN_EXPORT_FORMAT) return certifyRun(json as RunExport, parsed.values.pattern, parsed.values.json === true)
  const read = await readPatternFile(file)
  if ('error' in read) { console.error(read.error); return 2 }
  const m = compilePattern(read.doc)
  const cert = certifyDrawing(m, read.doc.phases !== undefined)
  const existence = certifiedExistence(analyzePattern(read.doc).existence, provenParts(cert))
  const checklist = existence.items
  const ok = cert.horizontal.certified && (cert.phase === null || cert.phase.certified)
  if (parsed.values.json) {
    console.log(JSON.stringify({ certificate: cert, checklist, existence, norms: NORMS }, null, 2))
  } else {
    console.log(`${read.doc.name}`)
    console.log(`  horizontal balance: ${describeCertificate(cert.horizontal)}`)
    console.log(`  phase balance:      ${cert.phase ? describeCertificate(cert.phase) : 'no phase data (trivial phases)'}`)
    console.log(`  ${NORMS}`)
    console.log(`Hypotheses of the existence theorem (${existence.theorem}):`)
    for (const c of checklist) console.log(`  ${c.id.padEnd(4)} ${c.label.padEnd(42)} ${STATUS_WORDS[c.status]}`)
    console.log(`  ${existence.line}`)
    if (checklist.some(c => c.status === 'proven-interval')) console.log('  Proven means: a unique zero of the equations within the certified radius, with an invertible Jacobian there (balance and rigidity at that true zero, not at the float drawing).')
    if (m.space === 'plane' && cert.horizontal.certified) console.log(`  Plane: rank M = 2V at that drawing, so the balanced drawings near it form a family of dimension ${m.nWings - 2} (|R| − 2) modulo translation.`)
    if (!checklist.every(c => c.status === 'proven-interval' || c.status === 'exact')) console.log('Items marked numerical evidence are not proofs.')
  }
  return ok ? 0 : 1
}

interface RunExport { format: string; name?: string; settings: unknown; points: { index: number; lambda: number; u: number[] }[] }

async function certifyRun(exp: RunExport, patternFile: unknown, asJson: boolean): Promise<number> {
  if (typeof patternFile !== 'string') { console.error('wingfold certify: a run export needs --pattern PATTERN (the document the run was computed on)'); return 2 }
  const read = await readPatternFile(patternFile)
  if ('error' in read) { console.error(read.error); return 2 }
  let certs, segments
  try {
    certs = certifyFamilyPoints(read.doc, exp.settings as never, exp.points ?? [], {
      onProgress: (done, total) => { if (!asJson && process.stderr.isTTY) process.stderr.write(`\r  certified ${done}/${total}`) },
    })
    segments = certifyFamilySegments(read.doc, exp.settings as never, exp.points ?? [], certs)
  } catch (e) { console.error(`wingfold certify: ${(e as Error).message}`); return 2 }
  const proven = certs.filter(c => c.certificate.certified).length
  const provenSegments = segments.filter(s => s.certificate.certified).length
  if (asJson) console.log(JSON.stringify({ points: certs, segments, norms: NORMS }, null, 2))
  else {
    console.log(`${exp.name ?? 'run'}: ${proven} of ${certs.length} points certified, ${provenSegments} of ${segments.length} segments`)
    for (const c of certs) console.log(`  point ${String(c.index).padStart(4)}  λ = ${c.lambda.toPrecision(8).padEnd(12)} ${describeCertificate(c.certificate)}`)
    for (const s of segments) console.log(`  segment ${s.from}–${s.to}  λ from ${s.lambdaFrom.toPrecision(6)} to ${s.lambdaTo.toPrecision(6)}: ${describeCertificate(s.certificate)}`)
    console.log(`  ${NORMS}`)
  }
  return proven === certs.length ? 0 : 1
}
