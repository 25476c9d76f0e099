/** Length levels and vertical equations as the workbench shows them, from real reports of the core. */
import { describe, expect, it } from 'vitest'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { edgeLevels, equationText, levelColour } from '../../../app/utils/workbench/levels'
import { verdictRows } from '../../../app/utils/workbench/verdict-rows'
import { meeks } from '../pattern/published-patterns'

describe('workbench levels and equations', () => {
  it('Meeks in an acute lattice [H. Chen, M. Traizet, arXiv 2103.15676, Ex. 7.1]: e2, e4 on level 1, e1, e3 on level 2; one equation', () => {
    const r = analyzePattern(meeks([1, 0], [0.3, 1.3], 2 * Math.PI / 3, Math.PI / 3))
    const lv = edgeLevels(r)
    expect([lv.get('e2'), lv.get('e4'), lv.get('e1'), lv.get('e3')]).toEqual([0, 0, 1, 1])
    expect(r.verdicts.phaseBalance.equations.map(equationText)).toEqual(['{w}: −e2 − e4'])
    expect(levelColour(0)).not.toBe(levelColour(1))
    const row = verdictRows(r).find(x => x.name === 'phaseBalance')!
    expect(row.detail).toMatch(/^1 equation · residual .* · depends on K$/)
  })
})
