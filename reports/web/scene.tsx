/** Draws a Scene as inline SVG; it scales to the column width through CSS. */
import type { Scene } from '../model/scene'

export function SceneSvg({ scene, label }: { scene: Scene; label: string }) {
  return (
    <svg className="inv-scene" viewBox={`0 0 ${scene.width} ${scene.height}`} role="img" aria-label={label}>
      {scene.items.map((it, i) => {
        switch (it.kind) {
          case 'line':
            return <line key={i} x1={it.x1} y1={it.y1} x2={it.x2} y2={it.y2} stroke={it.stroke} strokeWidth={it.width} strokeDasharray={it.dash} />
          case 'circle':
            return <circle key={i} cx={it.cx} cy={it.cy} r={it.r} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'rect':
            return <rect key={i} x={it.x} y={it.y} width={it.w} height={it.h} fill={it.fill} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} />
          case 'path':
            return <path key={i} d={it.d} fill={it.fill ?? 'none'} stroke={it.stroke ?? 'none'} strokeWidth={it.width ?? 0} strokeDasharray={it.dash} />
          case 'text':
            return (
              <text key={i} x={it.x} y={it.y} textAnchor={it.anchor ?? 'start'} fill={it.fill ?? '#000'} fontSize={it.size} fontWeight={it.bold ? 700 : 400}>
                {it.text}
              </text>
            )
        }
      })}
    </svg>
  )
}
