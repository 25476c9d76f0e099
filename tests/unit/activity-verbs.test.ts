import { describe, expect, it } from 'vitest'
import { activityVerbGroup } from '../../shared/types/team'

describe('activity filter groups by verb', () => {
  it('puts every finish reason under "finished"', () => {
    expect(activityVerbGroup('finished (stopped: no convergence at λ = 0.31)')).toBe('finished')
    expect(activityVerbGroup('finished (complete)')).toBe('finished')
    expect(activityVerbGroup('finished')).toBe('finished')
  })
  it('keeps verbs of several words whole', () => {
    expect(activityVerbGroup('changed role')).toBe('changed role')
    expect(activityVerbGroup('withdrew invitation')).toBe('withdrew invitation')
  })
})
