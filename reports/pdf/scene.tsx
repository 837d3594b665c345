/** Draws a Scene with react-pdf's Svg primitives. */
import { Circle, Line, Path, Rect, Svg, Text } from '@react-pdf/renderer'
import type { Scene } from '../model/scene'
import { MONO, SANS } from './fonts'

/** SVG text takes one family: Noto Sans, or its Mono where the Sans lacks a glyph (−, ≤, ≥, √). */
const familyOf = (text: string): string => (/[\u2212\u2264\u2265\u221a]/.test(text) ? MONO : SANS)

type TextProps = React.ComponentProps<typeof Text>

/** react-pdf's types omit the SVG text attributes its layout reads. */
function svgTextProps(x: number, y: number, textAnchor: string, fill: string, fontSize: number, fontWeight: number, family: string): TextProps {
  return { x, y, textAnchor, fill, fontFamily: family, fontSize, fontWeight } as unknown as TextProps
}

export function SceneSvg({ scene }: { scene: Scene }) {
  return (
    <Svg width={scene.width} height={scene.height} viewBox={`0 0 ${scene.width} ${scene.height}`}>
      {scene.items.map((it, i) => {
        switch (it.kind) {
          case 'line':
            return <Line key={i} x1={it.x1} y1={it.y1} x2={it.x2} y2={it.y2} stroke={it.stroke} strokeWidth={it.width} strokeDasharray={it.dash} />
          case 'circle':
            return <Circle key={i} cx={it.cx} cy={it.cy} r={it.r} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'rect':
            return <Rect key={i} x={it.x} y={it.y} width={it.w} height={it.h} fill={it.fill} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'path':
            return <Path key={i} d={it.d} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} strokeDasharray={it.dash} />
          case 'text':
            return (
              // SVG text takes font settings as presentation props; a style object is ignored and falls back to Helvetica.
              <Text key={i} {...svgTextProps(it.x, it.y, it.anchor ?? 'start', it.fill ?? '#000', it.size, it.bold ? 700 : 400, familyOf(it.text))}>
                {it.text}
              </Text>
            )
        }
      })}
    </Svg>
  )
}
