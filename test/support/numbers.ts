// Walking the numbers of a document: every numeric leaf of a JSON value (to
// put a hostile value in each field in turn) and every number schema of a
// JSON Schema (to see that each one is bounded).

export type Leaf = { path: (string | number)[]; value: number };

/** Every number inside a JSON value, with its path of keys and indices. */
export function numericLeaves(value: unknown, path: (string | number)[] = [], out: Leaf[] = []): Leaf[] {
  if (typeof value === "number") out.push({ path, value });
  else if (Array.isArray(value)) value.forEach((item, index) => numericLeaves(item, [...path, index], out));
  else if (value && typeof value === "object") for (const [key, item] of Object.entries(value)) numericLeaves(item, [...path, key], out);
  return out;
}

/** A copy of `document` with the leaf at `path` replaced by `value`. */
export function withLeaf<T>(document: T, path: readonly (string | number)[], value: unknown): T {
  const copy = structuredClone(document) as Record<string | number, unknown>;
  let node = copy;
  for (const key of path.slice(0, -1)) node = node[key] as Record<string | number, unknown>;
  node[path[path.length - 1]] = value;
  return copy as T;
}

export type NumberSchema = { pointer: string; schema: Record<string, unknown> };

/** Every `"type": "number"` or `"integer"` node of a JSON Schema, with its JSON Pointer. */
export function numberSchemas(schema: unknown, pointer = "", out: NumberSchema[] = []): NumberSchema[] {
  if (Array.isArray(schema)) schema.forEach((item, index) => numberSchemas(item, `${pointer}/${index}`, out));
  else if (schema && typeof schema === "object") {
    const node = schema as Record<string, unknown>;
    if (node.type === "number" || node.type === "integer") out.push({ pointer, schema: node });
    for (const [key, item] of Object.entries(node)) numberSchemas(item, `${pointer}/${key}`, out);
  }
  return out;
}

/** True when a number schema has a lower and an upper bound (inclusive or not). */
export function isBounded(schema: Record<string, unknown>): boolean {
  const low = typeof schema.minimum === "number" || typeof schema.exclusiveMinimum === "number";
  const high = typeof schema.maximum === "number" || typeof schema.exclusiveMaximum === "number";
  return low && high;
}
