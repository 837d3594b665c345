/** Step formulas on the web: KaTeX HTML, cached by TeX like the PDF's outlines. */
import katex from 'katex'

const cache = new Map<string, string>()

export function texHtml(tex: string, display: boolean): string {
  const key = `${display ? 'D' : 'I'}${tex}`
  let html = cache.get(key)
  if (html === undefined) {
    html = katex.renderToString(tex, { displayMode: display, output: 'htmlAndMathml', throwOnError: false, strict: 'ignore' })
    cache.set(key, html)
  }
  return html
}

export function Tex({ tex, display = false }: { tex: string; display?: boolean }) {
  return <span className="inv-tex" dangerouslySetInnerHTML={{ __html: texHtml(tex, display) }} />
}
