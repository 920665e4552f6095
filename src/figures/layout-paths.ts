// Reading and writing one field of a layout document by its dotted path ("frontView.lowerOuter.y"),
// immutably: untouched branches keep their identity, so selectors and undo history stay cheap.

export type LayoutPath = string;

export function getAt(doc: unknown, path: LayoutPath): unknown {
  let cur: unknown = doc;
  for (const key of path.split(".")) {
    if (cur === null || typeof cur !== "object") return undefined;
    cur = (cur as Record<string, unknown>)[key];
  }
  return cur;
}

/** A copy of `doc` with `path` set to `value` (or removed when value is undefined). */
export function setAt<T>(doc: T, path: LayoutPath, value: unknown): T {
  const keys = path.split(".");
  const write = (node: unknown, i: number): unknown => {
    const key = keys[i]!;
    const base = node !== null && typeof node === "object" && !Array.isArray(node) ? (node as Record<string, unknown>) : {};
    if (i === keys.length - 1) {
      if (value === undefined) {
        if (!(key in base)) return node;
        const { [key]: _removed, ...rest } = base;
        void _removed;
        return rest;
      }
      if (base[key] === value) return node;
      return { ...base, [key]: value };
    }
    const child = write(base[key], i + 1);
    return child === base[key] ? node : { ...base, [key]: child };
  };
  return write(doc, 0) as T;
}
