/** Reading and writing a dotted path (`geometry.arm`, `loads.0.fx`) of the inputs tree without mutating it. */
export type Tree = Record<string, unknown>

export function getPath(tree: unknown, path: string): unknown {
  return path.split('.').reduce<unknown>((node, key) => (node && typeof node === 'object' ? (node as Tree)[key] : undefined), tree)
}

/** A copy of `tree` with `path` set to `value`; `undefined` removes the key and any object it leaves empty. */
export function setPath<T>(tree: T, path: string, value: unknown): T {
  const [key, ...rest] = path.split('.')
  const node = (tree ?? {}) as Tree | unknown[]
  const copy: Tree | unknown[] = Array.isArray(node) ? [...node] : { ...node }
  const child = rest.length ? setPath((copy as Tree)[key], rest.join('.'), value) : value
  const empty = child === undefined || (child && typeof child === 'object' && !Array.isArray(child) && Object.keys(child).length === 0)
  if (empty && !Array.isArray(copy)) delete (copy as Tree)[key]
  else (copy as Tree)[key] = child
  return copy as T
}
