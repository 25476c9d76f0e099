/**
 * Comment Markdown → HTML with markdown-it and raw HTML disabled (`html: false`): any `<tag>` in
 * a comment is shown as text, so there is nothing to sanitise. markdown-it's default link
 * validator already refuses `javascript:`, `vbscript:`, `file:` and non-image `data:` URLs.
 * Links open in a new tab without referrer or opener.
 */
import MarkdownIt from 'markdown-it'

const md = new MarkdownIt({ html: false, linkify: true, breaks: true })
const defaultLinkOpen = md.renderer.rules.link_open ?? ((tokens, idx, options, _env, self) => self.renderToken(tokens,
  idx, options))
md.renderer.rules.link_open = (tokens, idx, options, env, self) => {
  tokens[idx]!.attrSet('rel', 'nofollow noopener noreferrer')
  tokens[idx]!.attrSet('target', '_blank')
  return defaultLinkOpen(tokens, idx, options, env, self)
}

/** Render a comment body to safe HTML. */
export function renderCommentMarkdown(body: string): string {
  return md.render(body)
}
