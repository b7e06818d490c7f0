// A rule's rationale is markdown on the page; the PDF writes it as plain sentences.
import { marked, type Token } from 'marked'

/** A rule's markdown rationale as plain sentences: list items on their own lines, no markup. */
export function markdownToPlain(markdown: string): string {
  const inline = (tokens: Token[] | undefined): string => (tokens ?? []).map((t) => {
    if ('tokens' in t && t.tokens) return inline(t.tokens)
    if (t.type === 'br') return '\n'
    if (t.type === 'html') return ''
    return 'text' in t ? String(t.text) : ''
  }).join('')
  const block = (tokens: Token[]): string[] => tokens.flatMap((t): string[] => {
    if (t.type === 'space' || t.type === 'hr' || t.type === 'html') return []
    if (t.type === 'list') return t.items.map((item: { tokens: Token[] }) => `• ${block(item.tokens).join(' ')}`)
    if (t.type === 'code') return [t.text]
    if (t.type === 'blockquote') return block(t.tokens ?? [])
    if ('tokens' in t && t.tokens) return [inline(t.tokens)]
    return 'text' in t ? [String(t.text)] : []
  })
  return block(marked.lexer(markdown)).map((line) => line.replace(/&(amp|lt|gt|quot|#39);/g, (_, e: string) => (
    { amp: '&', lt: '<', gt: '>', quot: '"', '#39': "'" } as Record<string, string>)[e]!)).join('\n')
}
