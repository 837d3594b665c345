/**
 * Compiles a calc type's MDX template once per rendering mode and keeps the
 * result: mdx-bundler runs esbuild, which costs far more than a render.
 * Templates are read at runtime from `<rootDir>/reports/mechanisms/<id>/template.mdx`
 * (reports/mechanisms), so the module still works after being bundled into a single file.
 */
import { readFile } from 'node:fs/promises'
import { bundleMDX } from 'mdx-bundler'
import remarkMath from 'remark-math'
import rehypeKatex from 'rehype-katex'
import type { MechanismId } from '../../lib/contract'
import { templatePath } from '../mechanisms'
import type { RenderOptions } from '../types'
import { readMeta, type TemplateMeta } from '../model/context'
import { type Outline, rehypeStripBlockWhitespace, remarkMathToJsx, remarkOutline, remarkTagEquations } from './plugins'

export type Mode = 'web' | 'pdf'

export interface CompiledTemplate {
  code: string
  meta: TemplateMeta
  outline: Outline
}

const cache = new Map<string, Promise<CompiledTemplate>>()

export async function loadTemplate(type: MechanismId, opts: RenderOptions = {}): Promise<string> {
  return readFile(templatePath(type, opts), 'utf8')
}

export function compileTemplate(source: string, mode: Mode): Promise<CompiledTemplate> {
  // Keyed by the source itself: an edited template recompiles, a repeated one never does.
  const key = `${mode}\u0000${source}`
  let hit = cache.get(key)
  if (!hit) {
    hit = compile(source, mode)
    hit.catch(() => cache.delete(key))
    cache.set(key, hit)
  }
  return hit
}

async function compile(source: string, mode: Mode): Promise<CompiledTemplate> {
  const outline: Outline = { sections: [], figures: [] }
  const { code, frontmatter } = await bundleMDX({
    source,
    mdxOptions(options) {
      options.remarkPlugins = [
        ...(options.remarkPlugins ?? []),
        remarkMath,
        remarkOutline(outline),
        mode === 'web' ? remarkTagEquations : remarkMathToJsx,
      ]
      options.rehypePlugins = [
        ...(options.rehypePlugins ?? []),
        ...(mode === 'web' ? [[rehypeKatex, { output: 'htmlAndMathml', strict: 'ignore' }] as const] : []),
        rehypeStripBlockWhitespace,
      ]
      return options
    },
  })
  return { code, meta: readMeta(frontmatter), outline }
}
