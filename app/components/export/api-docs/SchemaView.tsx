// A JSON Schema (2020-12) shown as nested lists a person can read: each
// property with its type, constraints and description. References to the
// document's components link to them; a schema's own $defs are opened in place.
type Schema = Record<string, unknown>;

export type SchemaContext = {
  /** The schema whose $defs local references point into. */
  root: Schema;
  /** Where `#/components/schemas/<name>` links go. */
  componentHref: (name: string) => string;
};

const MAX_DEPTH = 8;

const isSchema = (value: unknown): value is Schema => typeof value === "object" && value !== null && !Array.isArray(value);

/** Follows `#/$defs/…` inside the root (JSON Pointer, RFC 6901 escapes). */
function resolveLocal(root: Schema, ref: string): Schema | null {
  if (!ref.startsWith("#/")) return null;
  let node: unknown = root;
  for (const part of ref.slice(2).split("/")) {
    const key = part.replaceAll("~1", "/").replaceAll("~0", "~");
    if (!isSchema(node)) return null;
    node = node[key];
  }
  return isSchema(node) ? node : null;
}

const componentName = (ref: string) => (ref.startsWith("#/components/schemas/") ? ref.slice("#/components/schemas/".length) : null);

/** A short type text: "string", "integer ≥ 1", "array of number", "one of …". */
export function typeText(schema: Schema, context: SchemaContext): string {
  if (typeof schema.$ref === "string") {
    const name = componentName(schema.$ref);
    if (name) return name;
    const target = resolveLocal(context.root, schema.$ref);
    return target ? typeText(target, context) : schema.$ref;
  }
  if ("const" in schema) return `= ${JSON.stringify(schema.const)}`;
  if (Array.isArray(schema.enum)) return `one of ${schema.enum.map((value) => JSON.stringify(value)).join(", ")}`;
  for (const key of ["anyOf", "oneOf"] as const) {
    const options = schema[key];
    if (Array.isArray(options)) return options.map((option) => (isSchema(option) ? typeText(option, context) : "?")).join(" or ");
  }
  if (Array.isArray(schema.allOf)) return schema.allOf.map((option) => (isSchema(option) ? typeText(option, context) : "?")).join(" and ");
  const type = Array.isArray(schema.type) ? schema.type.join(" or ") : typeof schema.type === "string" ? schema.type : schema.properties ? "object" : "any";
  if (type === "array") {
    if (isSchema(schema.items)) return `array of ${typeText(schema.items, context)}`;
    if (Array.isArray(schema.prefixItems)) return `[${schema.prefixItems.map((item) => (isSchema(item) ? typeText(item, context) : "?")).join(", ")}]`;
  }
  if (type === "object" && !schema.properties && isSchema(schema.additionalProperties)) return `map of ${typeText(schema.additionalProperties, context)}`;
  return type;
}

/** Limits and extras in words: ≥ 0, ≤ 1000, pattern, format, default. */
export function constraintsText(schema: Schema): string[] {
  const parts: string[] = [];
  if (typeof schema.format === "string") parts.push(schema.format);
  if (typeof schema.minimum === "number") parts.push(`≥ ${schema.minimum}`);
  if (typeof schema.exclusiveMinimum === "number") parts.push(`> ${schema.exclusiveMinimum}`);
  if (typeof schema.maximum === "number") parts.push(`≤ ${schema.maximum}`);
  if (typeof schema.exclusiveMaximum === "number") parts.push(`< ${schema.exclusiveMaximum}`);
  if (typeof schema.minLength === "number") parts.push(`length ≥ ${schema.minLength}`);
  if (typeof schema.maxLength === "number") parts.push(`length ≤ ${schema.maxLength}`);
  if (typeof schema.minItems === "number") parts.push(`≥ ${schema.minItems} items`);
  if (typeof schema.maxItems === "number") parts.push(`≤ ${schema.maxItems} items`);
  if (typeof schema.pattern === "string") parts.push(`matches /${schema.pattern}/`);
  if ("default" in schema) parts.push(`default ${JSON.stringify(schema.default)}`);
  if (schema.additionalProperties === false && schema.properties) parts.push("no other fields");
  return parts;
}

/** The schema's children worth opening: properties of an object, the item of an array, the options of a union. */
function children(schema: Schema, context: SchemaContext): { schema: Schema; name?: string; required?: boolean; label?: string }[] {
  if (typeof schema.$ref === "string") {
    if (componentName(schema.$ref)) return [];
    const target = resolveLocal(context.root, schema.$ref);
    return target ? children(target, context) : [];
  }
  if (isSchema(schema.properties)) {
    const required = new Set(Array.isArray(schema.required) ? (schema.required as string[]) : []);
    const listed = Object.entries(schema.properties).filter((entry): entry is [string, Schema] => isSchema(entry[1]));
    const extra = isSchema(schema.additionalProperties) ? [{ schema: schema.additionalProperties, name: "<any name>", required: false }] : [];
    return [...listed.map(([name, child]) => ({ schema: child, name, required: required.has(name) })), ...extra];
  }
  if (isSchema(schema.additionalProperties))
    return children(schema.additionalProperties, context).length ? [{ schema: schema.additionalProperties, name: "<any name>" }] : [];
  if (isSchema(schema.items)) return children(schema.items, context);
  for (const key of ["anyOf", "oneOf", "allOf"] as const) {
    const options = schema[key];
    if (Array.isArray(options)) {
      return options
        .filter(isSchema)
        .flatMap((option, index) =>
          children(option, context).length ? [{ schema: option, label: `${key === "allOf" ? "part" : "option"} ${index + 1}` }] : [],
        );
    }
  }
  return [];
}

function TypeLine({ schema, context }: { schema: Schema; context: SchemaContext }) {
  const name = typeof schema.$ref === "string" ? componentName(schema.$ref) : null;
  const text = typeText(schema, context);
  return name ? (
    <a href={context.componentHref(name)} className="text-accent underline underline-offset-2">
      {text}
    </a>
  ) : (
    <span>{text}</span>
  );
}

function Node({
  schema,
  context,
  name,
  required,
  label,
  depth,
}: {
  schema: Schema;
  context: SchemaContext;
  name?: string;
  required?: boolean;
  label?: string;
  depth: number;
}) {
  const nested = depth < MAX_DEPTH ? children(schema, context) : [];
  const description = typeof schema.description === "string" ? schema.description : null;
  const constraints = constraintsText(schema);
  const head = (
    <span className="inline-flex flex-wrap items-baseline gap-x-2">
      {name ? <code className="font-mono font-medium text-ink">{name}</code> : label ? <span className="text-ink-muted">{label}</span> : null}
      <span className="font-mono text-xs text-ink-muted">
        <TypeLine schema={schema} context={context} />
      </span>
      {required ? <span className="rounded bg-accent-soft px-1.5 text-xs text-accent-strong">required</span> : null}
      {constraints.length ? <span className="text-xs text-ink-muted">{constraints.join(" · ")}</span> : null}
    </span>
  );
  return (
    <li className="py-1">
      {nested.length ? (
        <details open={depth < 1}>
          <summary className="cursor-pointer">{head}</summary>
          {description ? <p className="mt-0.5 text-sm text-ink-muted">{description}</p> : null}
          <ul className="ml-3 border-l border-line pl-4">
            {nested.map((child, index) => (
              <Node key={child.name ?? child.label ?? index} {...child} context={context} depth={depth + 1} />
            ))}
          </ul>
        </details>
      ) : (
        <>
          {head}
          {description ? <p className="mt-0.5 text-sm text-ink-muted">{description}</p> : null}
        </>
      )}
    </li>
  );
}

/** One schema as a tree; `root` is the schema its local references resolve in (default: itself). */
export function SchemaView({ schema, root, componentHref }: { schema: Schema; root?: Schema; componentHref: SchemaContext["componentHref"] }) {
  const context: SchemaContext = { root: root ?? schema, componentHref };
  return (
    <ul className="text-sm">
      <Node schema={schema} context={context} depth={0} />
    </ul>
  );
}
