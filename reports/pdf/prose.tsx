/**
 * Markdown elements for the PDF. A paragraph without math is one <Text>; a
 * paragraph with inline math becomes a wrapping row of words and formulas,
 * because react-pdf cannot place an Svg inside Text.
 */
import { Children, Fragment, isValidElement, type ReactElement, type ReactNode } from 'react'
import { Link, Text, View } from '@react-pdf/renderer'
import type { Style } from '@react-pdf/stylesheet'
import { MathInlineItem } from './math'
import { BODY_SIZE, s } from './styles'

type Props = { children?: ReactNode }

export function Em({ children }: Props) {
  return <Text style={s.em}>{children}</Text>
}
export function Strong({ children }: Props) {
  return <Text style={s.strong}>{children}</Text>
}
export function Code({ children }: Props) {
  return <Text style={s.code}>{children}</Text>
}
export function A({ children, href }: Props & { href?: string }) {
  return href ? <Link src={href}>{children}</Link> : <Text>{children}</Text>
}
export function MathInline({ tex }: { tex: string }) {
  return <MathInlineItem tex={tex} />
}

const STYLE_OF = new Map<unknown, Style>([[Em, s.em], [Strong, s.strong], [Code, s.code]])

const isMath = (c: ReactNode): c is ReactElement<{ tex: string }> => isValidElement(c) && c.type === MathInline

function hasMath(children: ReactNode): boolean {
  return Children.toArray(children).some(
    (c) => isMath(c) || (isValidElement<Props>(c) && hasMath(c.props.children)),
  )
}

interface Token {
  word?: string
  tex?: string
  style: Style[]
  spaceBefore: boolean
}

function tokenize(children: ReactNode, style: Style[], out: Token[], pending: { space: boolean }): void {
  Children.forEach(children, (c) => {
    if (typeof c === 'string' || typeof c === 'number') {
      for (const part of String(c).split(/(\s+)/)) {
        if (!part) continue
        if (/^\s+$/.test(part)) pending.space = true
        else {
          out.push({ word: part, style, spaceBefore: pending.space })
          pending.space = false
        }
      }
    } else if (isMath(c)) {
      out.push({ tex: c.props.tex, style, spaceBefore: pending.space })
      pending.space = false
    } else if (isValidElement<Props>(c)) {
      const extra = STYLE_OF.get(c.type)
      tokenize(c.props.children, extra ? [...style, extra] : style, out, pending)
    }
  })
}

/** Source line breaks inside a paragraph are spaces: react-pdf would keep them as breaks. */
function unwrap(children: ReactNode): ReactNode {
  return Children.map(children, (c) => (typeof c === 'string' ? c.replace(/[ \t]*\n[ \t]*/g, ' ') : c))
}

/** Paragraph-like content: plain Text when possible, a word row when math is present. */
export function Inline({ children, style }: Props & { style?: Style }) {
  if (!hasMath(children)) return <Text style={style}>{unwrap(children)}</Text>
  const tokens: Token[] = []
  tokenize(children, [], tokens, { space: false })
  const gap = BODY_SIZE * 0.27
  return (
    <View style={[{ flexDirection: 'row', flexWrap: 'wrap', alignItems: 'flex-end' }, style ?? {}]}>
      {tokens.map((t, i) => {
        // The gap trails the token before a space, so a wrapped line never starts indented.
        const gapAfter = tokens[i + 1]?.spaceBefore ? gap : 0
        return t.tex !== undefined ? (
          <MathInlineItem key={i} tex={t.tex} marginRight={gapAfter} />
        ) : (
          <Text key={i} style={[...t.style, { marginRight: gapAfter }]}>{t.word}</Text>
        )
      })}
    </View>
  )
}

export function P({ children }: Props) {
  return <Inline style={s.p}>{children}</Inline>
}
export function H2({ children }: Props) {
  return <Text style={s.h3} minPresenceAhead={40}>{children}</Text>
}
export function H3({ children }: Props) {
  return <Text style={s.h4} minPresenceAhead={30}>{children}</Text>
}

const blocks = (children: ReactNode) =>
  Children.toArray(children).filter((c) => !(typeof c === 'string' && !c.trim()))

function List({ children, ordered }: Props & { ordered: boolean }) {
  return (
    <View style={s.list}>
      {blocks(children).map((c, i) => (
        <View key={i} style={s.li} wrap={false}>
          <Text style={s.bullet}>{ordered ? `${i + 1}.` : '•'}</Text>
          <View style={s.liBody}>{isValidElement<Props>(c) ? c.props.children && renderLi(c.props.children) : null}</View>
        </View>
      ))}
    </View>
  )
}

/** Tight list items hold inline content; loose ones hold paragraphs. */
function renderLi(children: ReactNode): ReactNode {
  const kids = blocks(children)
  const block = kids.some((k) => isValidElement(k) && (k.type === P || k.type === UL || k.type === OL))
  return block ? <Fragment>{kids}</Fragment> : <Inline>{children}</Inline>
}

export function UL({ children }: Props) {
  return <List ordered={false}>{children}</List>
}
export function OL({ children }: Props) {
  return <List ordered>{children}</List>
}
/** List renders its items itself; this only exists so MDX has an `li` to create. */
export function LI({ children }: Props) {
  return <>{children}</>
}
