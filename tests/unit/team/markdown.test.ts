/** Comment Markdown: raw HTML is shown as text, unsafe link schemes are not linked. */
import { describe, expect, it } from 'vitest'
import { renderCommentMarkdown } from '../../../server/utils/comment-markdown'

describe('renderCommentMarkdown', () => {
  it('renders emphasis, code and lists', () => {
    expect(renderCommentMarkdown('a *fold* at `λ = 0.3`')).toBe('<p>a <em>fold</em> at <code>λ = 0.3</code></p>\n')
    expect(renderCommentMarkdown('- one\n- two')).toBe('<ul>\n<li>one</li>\n<li>two</li>\n</ul>\n')
  })

  it('escapes raw HTML instead of passing it through', () => {
    const html = renderCommentMarkdown('<script>alert(1)</script> <img src=x onerror=alert(1)>')
    expect(html).not.toMatch(/<script|<img/)
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;')
  })

  it('does not turn javascript: or data: URLs into links', () => {
    expect(renderCommentMarkdown('[x](javascript:alert(1))')).not.toContain('<a')
    expect(renderCommentMarkdown('[x](data:text/html;base64,PHNjcmlwdD4=)')).not.toContain('<a')
  })

  it('opens ordinary links in a new tab without opener or referrer', () => {
    expect(renderCommentMarkdown('[notes](https://example.org/n)')).toBe('<p><a href="https://example.org/n" rel="nofollow noopener noreferrer" target="_blank">notes</a></p>\n')
  })
})
