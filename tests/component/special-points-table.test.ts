/**
 * The special points table in happy-dom: sorted by λ at first, a header click sorts by its column
 * (again: the other way) and says so in aria-sort, the filter matches kind and label, and only a
 * branch point offers "Switch branch" to an editor.
 */
import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import SpecialPointsTable, { type SpecialRow } from '../../app/components/family/SpecialPointsTable.vue'

const row = (index: number, kind: string, lambda: number, label: string): SpecialRow =>
  ({ run: 1, index, kind, label, lambda, sigmaMin: 0.5, precision: 1e-10, located: true, afterPoint: index })
const rows = [
  row(0, 'fold', 3.7, 'fold: λ turns back'),
  row(1, 'branch point', 0.5, 'branch point: two branches cross'),
  row(2, 'collapse', 2.1, 'collapse: edge e0'),
]
const kinds = (w: Awaited<ReturnType<typeof mountSuspended>>) => w.findAll('tbody tr').map((tr: { attributes: (name: string) => string | undefined }) => tr.attributes('data-kind'))

describe('SpecialPointsTable', () => {
  it('starts sorted by λ and sorts by kind on a header click, both ways', async () => {
    const w = await mountSuspended(SpecialPointsTable, { props: { rows } })
    expect(kinds(w)).toEqual(['branch point', 'collapse', 'fold'])
    const kindHeader = w.findAll('th').find(th => th.text().startsWith('Kind'))!
    await kindHeader.find('button').trigger('click')
    expect(kinds(w)).toEqual(['branch point', 'collapse', 'fold'])
    expect(kindHeader.attributes('aria-sort')).toBe('ascending')
    await kindHeader.find('button').trigger('click')
    expect(kinds(w)).toEqual(['fold', 'collapse', 'branch point'])
    expect(kindHeader.attributes('aria-sort')).toBe('descending')
    const lambdaHeader = w.findAll('th').find(th => th.text().startsWith('λ'))!
    expect(lambdaHeader.attributes('aria-sort')).toBe('none')
    await lambdaHeader.find('button').trigger('click')
    expect(w.findAll('[data-testid=special-lambda]').map(td => Number(td.text()))).toEqual([0.5, 2.1, 3.7])
  })

  it('filters by kind or label', async () => {
    const w = await mountSuspended(SpecialPointsTable, { props: { rows } })
    await w.find('input[aria-label="Filter special points"]').setValue('EDGE')
    expect(kinds(w)).toEqual(['collapse'])
    await w.find('input[aria-label="Filter special points"]').setValue('branch')
    expect(kinds(w)).toEqual(['branch point'])
  })

  it('offers "Switch branch" only at a branch point, only to editors, and emits the row', async () => {
    const viewer = await mountSuspended(SpecialPointsTable, { props: { rows } })
    expect(viewer.findAll('button').some(b => b.text() === 'Switch branch')).toBe(false)
    const editor = await mountSuspended(SpecialPointsTable, { props: { rows, canEdit: true } })
    const switches = editor.findAll('button').filter(b => b.text() === 'Switch branch')
    expect(switches).toHaveLength(1)
    await switches[0]!.trigger('click')
    expect(editor.emitted('switchBranch')).toEqual([[rows[1]]])
    expect(editor.emitted('select')).toBeUndefined() // the click does not also select the row
  })

  it('says so when there are no special points', async () => {
    const w = await mountSuspended(SpecialPointsTable, { props: { rows: [] } })
    expect(w.find('table').exists()).toBe(false)
    expect(w.text()).toContain('No special points')
  })
})
