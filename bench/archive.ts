/**
 * `npx tsx bench/archive.ts [--runs=N]`: size and time of a project archive for the largest demo
 * project ("Genus-three torus gluings", six patterns) after it is filled like a working group's
 * project: a second version of the Fermat pattern, N verified shear runs (default 20, each with
 * two comments) and a saved map (the demo seed itself holds no runs). Export from one built
 * server, import into a fresh one (where every run and map is verified again). Needs
 * `npx nuxt build` first. Targets are printed beside the figures; nothing is asserted.
 */
import { performance } from 'node:perf_hooks'
import { signInAs, signUp } from '../tests/support/http'
import { startServer } from '../tests/support/server'
import { fillProject, importArchive } from '../tests/server/archive-support'
import { projectIdByName } from '../tests/server/runs-helpers'

const runs = Number(process.argv.find(a => a.startsWith('--runs='))?.slice(7) ?? 20)
const [source, target] = await Promise.all([startServer(), startServer()])
try {
  const owner = await signInAs(source.url, 'owner')
  const projectId = await projectIdByName(owner, 'Genus-three torus gluings')
  await fillProject(owner, projectId, runs)
  const t0 = performance.now()
  const res = await owner.fetch(`/api/projects/${projectId}/archive`)
  if (res.status !== 200 || !res.body) throw new Error(`export answered ${res.status}`)
  const reader = res.body.getReader()
  const parts: Uint8Array[] = []
  let firstByteMs = 0
  for (;;) {
    const { done, value } = await reader.read()
    if (done) break
    if (!parts.length) firstByteMs = performance.now() - t0
    parts.push(value)
  }
  const exportMs = performance.now() - t0
  const archive = { bytes: new Uint8Array(Buffer.concat(parts)) }
  const importer = await signUp(target.url, 'Bench Importer', 'bench@elsewhere.example')
  const t1 = performance.now()
  const imported = await importArchive(importer, archive.bytes)
  const importMs = performance.now() - t1
  if (imported.status !== 201) throw new Error(`import answered ${imported.status}: ${JSON.stringify(imported.body)}`)
  const c = imported.body.counts as Record<string, number>
  console.log(`project: ${c.graphs} patterns, ${c.graph_versions} versions, ${c.runs} runs, ${c.run_points} points (regular and special), ${c.comments} comments, ${c.maps} maps, ${c.activity} activity entries`)
  console.log(`archive size            ${(archive.bytes.length / 1024).toFixed(1).padStart(8)} KiB`)
  console.log(`export (HTTP, streamed) ${exportMs.toFixed(0).padStart(8)} ms   target < 2000 ms   (first bytes after ${firstByteMs.toFixed(0)} ms)`)
  console.log(`import (HTTP, verified) ${importMs.toFixed(0).padStart(8)} ms   target < 10000 ms   (${imported.body.runs.verified} runs and ${imported.body.maps.verified} maps verified again)`)
} finally {
  await Promise.all([source.stop(), target.stop()])
}
