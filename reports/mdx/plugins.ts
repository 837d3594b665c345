/**
 * Unified plugins shared by both compiles. Numbering happens here, at compile
 * time and in document order, so the web view and the PDF cannot disagree on a
 * section or equation number.
 */
import { FIGURE_COMPONENTS } from '../components'

/** The few fields of mdast / hast / mdx-jsx nodes these plugins touch. */
export interface AstNode {
  type: string
  value?: string
  name?: string | null
  tagName?: string
  attributes?: { type: string; name: string; value?: unknown }[]
  children?: AstNode[]
  data?: Record<string, unknown>
}

function walk(node: AstNode, fn: (node: AstNode, parent: AstNode | null, index: number) => void, parent: AstNode | null = null, index = 0): void {
  fn(node, parent, index)
  node.children?.forEach((child, i) => walk(child, fn, node, i))
}



const attr = (name: string, value: string) => ({ type: 'mdxJsxAttribute', name, value })

/** What a template contains, in document order; numbering is decided per package from it. */
export interface Outline {
  sections: { id: string; when?: string }[]
  figures: { component: string; kind?: string; section: number }[]
}

const attrValue = (node: AstNode, name: string): string | undefined => {
  const v = node.attributes?.find((a) => a.name === name)?.value
  return typeof v === 'string' ? v : undefined
}

/**
 * Records sections and figures and tags each with its ordinal, so a section or
 * figure that a package leaves empty can be dropped without a gap in the
 * numbers. Display equations are numbered here directly.
 */
export function remarkOutline(outline: Outline) {
  return () => (tree: AstNode) => {
    let equation = 0
    walk(tree, (node) => {
      if (node.type === 'mdxJsxFlowElement' && node.name === 'Section') {
        node.attributes = [...(node.attributes ?? []), attr('ordinal', String(outline.sections.length))]
        outline.sections.push({ id: attrValue(node, 'id') ?? '', when: attrValue(node, 'when') })
      } else if (node.type === 'mdxJsxFlowElement' && FIGURE_COMPONENTS.includes(node.name ?? '')) {
        node.attributes = [...(node.attributes ?? []), attr('ordinal', String(outline.figures.length))]
        outline.figures.push({ component: node.name ?? '', kind: attrValue(node, 'kind'), section: outline.sections.length - 1 })
      } else if (node.type === 'math') {
        node.data = { ...node.data, equation: ++equation }
      }
    })
  }
}

/** Web: KaTeX draws the number, so the tag goes into the TeX itself. */
export function remarkTagEquations() {
  return (tree: AstNode) => {
    walk(tree, (node) => {
      const n = node.data?.equation
      if (node.type !== 'math' || typeof n !== 'number') return
      node.value = `${node.value ?? ''} \\tag{${n}}`
      // remark-math builds the hast from data.hChildren, captured at parse time.
      const kids = node.data?.hChildren
      if (Array.isArray(kids) && kids[0] && typeof kids[0] === 'object') (kids[0] as AstNode).value = node.value
    })
  }
}

/** PDF: math becomes components the PDF set renders as vector paths. */
export function remarkMathToJsx() {
  return (tree: AstNode) => {
    walk(tree, (node) => {
      if (node.type === 'math') {
        const n = node.data?.equation
        node.type = 'mdxJsxFlowElement'
        node.name = 'MathBlock'
        node.attributes = [attr('tex', node.value ?? ''), attr('number', String(n ?? ''))]
        node.children = []
      } else if (node.type === 'inlineMath') {
        node.type = 'mdxJsxTextElement'
        node.name = 'MathInline'
        node.attributes = [attr('tex', node.value ?? '')]
        node.children = []
      }
    })
  }
}

const FLOW_PARENTS = new Set(['root', 'mdxJsxFlowElement'])
const FLOW_TAGS = new Set(['ul', 'ol', 'table', 'thead', 'tbody', 'tr', 'blockquote'])

/**
 * MDX keeps the "\n" text between blocks; react-pdf rejects strings outside
 * <Text>. Only whitespace between blocks goes: spaces inside a paragraph stay.
 */
export function rehypeStripBlockWhitespace() {
  return (tree: AstNode) => {
    walk(tree, (node) => {
      const flow = FLOW_PARENTS.has(node.type) || (node.type === 'element' && FLOW_TAGS.has(node.tagName ?? ''))
      if (!flow || !node.children) return
      node.children = node.children.filter((c) => !(c.type === 'text' && !(c.value ?? '').trim()))
    })
  }
}
