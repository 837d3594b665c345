import { analyseFourBar, type FourBarOptions, type FourBarResult, type SizedFourBar } from '@/lib/fourbar'
import { getFourBar } from '@/lib/mechanisms'

/** The registry's four-bar `id` sized for stroke S, its rule with `rule` over it. */
export function sized(id: string, S: number, rule: Record<string, number> = {}): SizedFourBar {
  const f = getFourBar(id)
  return f.size(S, { ...f.rule, ...rule })
}

/** The four-bar `id` sized for opts.stroke and analysed. */
export const analysed = (id: string, opts: FourBarOptions, rule: Record<string, number> = {}): FourBarResult => analyseFourBar(sized(id, opts.stroke, rule), opts)
