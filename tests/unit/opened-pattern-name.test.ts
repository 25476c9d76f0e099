import { describe, expect, it } from 'vitest'
import { openedPatternName } from '../../app/utils/workbench/export'

describe('name of an opened pattern file', () => {
  it('keeps the document\'s own name', () => {
    expect(openedPatternName('Square ring of four', 'download.wfp.json')).toBe('Square ring of four')
  })
  it('takes the file\'s name when the document has only the blank placeholder', () => {
    expect(openedPatternName('Untitled pattern', 'hexagon-six.wfp.json')).toBe('hexagon-six')
    expect(openedPatternName('  ', 'Ring.JSON')).toBe('Ring')
    expect(openedPatternName('Untitled pattern', '.wfp.json')).toBe('Untitled pattern')
  })
})
