import { marked } from 'marked'
import DOMPurify from 'isomorphic-dompurify'

/** Our markdown (rule rationales, guidance articles) as sanitised HTML, the same on server and browser. */
export function renderMarkdown(source: string): string {
  const html = marked.parse(source, { async: false, gfm: true }) as string
  return DOMPurify.sanitize(html)
}
