// The OpenAPI document of /api/v1 as a page: the operations grouped by tag,
// each with who may call it, its parameters, body and answers, and the
// schemas below. Plain React over the JSON; no outside viewer.
import { SchemaView, constraintsText, typeText } from "./SchemaView";

type Schema = Record<string, unknown>;
type Parameter = { name: string; in: string; required: boolean; description?: string; schema: Schema };
type Response = { description: string; headers?: Record<string, { description: string }>; content?: Record<string, { schema: Schema }> } | { $ref: string };
type Operation = {
  operationId: string;
  summary: string;
  description?: string;
  tags: string[];
  security?: unknown[];
  parameters?: Parameter[];
  requestBody?: { required: boolean; content: Record<string, { schema: Schema }> };
  responses: Record<string, Response>;
  "x-permission": { action: string; roles: string[] };
};
export type ApiDocument = {
  info: { title: string; version: string; summary?: string; description?: string; [key: string]: unknown };
  servers: { url: string }[];
  tags: { name: string; description: string }[];
  paths: Record<string, Record<string, Operation>>;
  components: {
    securitySchemes: Record<string, { type: string; scheme?: string; in?: string; name?: string; description?: string }>;
    schemas: Record<string, Schema>;
    responses: Record<string, Response>;
  };
};

const METHOD_STYLES: Record<string, string> = {
  get: "bg-accent-soft text-accent-strong",
  post: "bg-ok-soft text-ok",
  put: "bg-warning-soft text-warning",
  delete: "bg-danger-soft text-danger",
};

const schemaHref = (name: string) => `#schema-${name}`;

/** Descriptions mark code with backticks, as OpenAPI's CommonMark does; only that is rendered. */
function Prose({ text }: { text: string }) {
  return (
    <>
      {text.split(/`([^`]+)`/).map((part, index) =>
        index % 2 === 1 ? (
          <code key={index} className="rounded bg-sunken px-1 font-mono text-[0.9em]">
            {part}
          </code>
        ) : (
          part
        ),
      )}
    </>
  );
}
const operationHref = (operation: Operation) => `#op-${operation.operationId}`;

function operationsOf(document: ApiDocument) {
  return Object.entries(document.paths).flatMap(([path, methods]) => Object.entries(methods).map(([method, operation]) => ({ path, method, operation })));
}

function Method({ method }: { method: string }) {
  return (
    <span className={`inline-block w-14 rounded px-1.5 py-0.5 text-center font-mono text-xs font-semibold uppercase ${METHOD_STYLES[method] ?? "bg-sunken"}`}>
      {method}
    </span>
  );
}

function ResponseRow({ status, response, document }: { status: string; response: Response; document: ApiDocument }) {
  const refName = "$ref" in response ? response.$ref.split("/").pop()! : null;
  const resolved = refName ? document.components.responses[refName] : response;
  if (!resolved || "$ref" in resolved) return null;
  return (
    <li className="border-b border-line py-2 last:border-0">
      <div className="flex flex-wrap items-baseline gap-x-3">
        <code className={`font-mono font-semibold ${Number(status) >= 400 ? "text-danger" : "text-ok"}`}>{status}</code>
        <span className="text-sm">
          <Prose text={resolved.description} />
        </span>
      </div>
      {resolved.headers ? (
        <ul className="mt-1 ml-10 text-xs text-ink-muted">
          {Object.entries(resolved.headers).map(([name, header]) => (
            <li key={name}>
              <code className="font-mono text-ink">{name}</code>: {header.description}
            </li>
          ))}
        </ul>
      ) : null}
      {resolved.content ? (
        <div className="mt-1 ml-10 space-y-1">
          {Object.entries(resolved.content).map(([type, body]) => (
            <div key={type} className="text-sm">
              <code className="font-mono text-xs text-ink-muted">{type}</code>{" "}
              {body.schema.$ref || body.schema.type !== "string" ? (
                <SchemaView schema={body.schema} componentHref={schemaHref} />
              ) : (
                <span className="text-xs text-ink-muted">{typeof body.schema.description === "string" ? body.schema.description : "text"}</span>
              )}
            </div>
          ))}
        </div>
      ) : null}
    </li>
  );
}

function OperationCard({ path, method, operation, document }: { path: string; method: string; operation: Operation; document: ApiDocument }) {
  const permission = operation["x-permission"];
  return (
    <article
      id={operation.operationId ? `op-${operation.operationId}` : undefined}
      aria-labelledby={`op-${operation.operationId}-title`}
      className="scroll-mt-4 rounded-lg border border-line bg-surface p-5"
    >
      <h3 id={`op-${operation.operationId}-title`} className="flex flex-wrap items-center gap-3">
        <Method method={method} />
        <code className="font-mono text-sm font-semibold break-all">{path}</code>
      </h3>
      <p className="mt-2 font-medium">{operation.summary}</p>
      {operation.description ? (
        <p className="mt-1 text-sm text-ink-muted">
          <Prose text={operation.description} />
        </p>
      ) : null}
      <p className="mt-2 text-sm">
        {permission.action === "public" ? (
          <span className="rounded bg-sunken px-2 py-0.5">Public: no token or session needed</span>
        ) : (
          <>
            Needs <code className="font-mono">{permission.action}</code>: {permission.roles.join(", ")}.
          </>
        )}
      </p>
      {operation.parameters?.length ? (
        <table className="mt-3 w-full border-collapse text-left text-sm">
          <caption className="mb-1 text-left text-xs font-medium tracking-wide text-ink-muted uppercase">Parameters</caption>
          <thead className="border-b border-line text-xs text-ink-muted">
            <tr>
              <th className="py-1 pr-3 font-medium">Name</th>
              <th className="py-1 pr-3 font-medium">In</th>
              <th className="py-1 pr-3 font-medium">Type</th>
              <th className="py-1 font-medium">Meaning</th>
            </tr>
          </thead>
          <tbody>
            {operation.parameters.map((parameter) => (
              <tr key={`${parameter.in}:${parameter.name}`} className="border-b border-line align-top last:border-0">
                <td className="py-1 pr-3">
                  <code className="font-mono">{parameter.name}</code>
                  {parameter.required ? <span className="ml-1 text-xs text-accent-strong">required</span> : null}
                </td>
                <td className="py-1 pr-3 text-ink-muted">{parameter.in}</td>
                <td className="py-1 pr-3 font-mono text-xs">
                  {typeText(parameter.schema, { root: parameter.schema, componentHref: schemaHref })}
                  {constraintsText(parameter.schema).length ? (
                    <span className="block text-ink-muted">{constraintsText(parameter.schema).join(" · ")}</span>
                  ) : null}
                </td>
                <td className="py-1 text-ink-muted">
                  <Prose text={parameter.description ?? ""} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      ) : null}
      {operation.requestBody ? (
        <div className="mt-3">
          <h4 className="text-xs font-medium tracking-wide text-ink-muted uppercase">Body{operation.requestBody.required ? " (required)" : ""}</h4>
          {Object.entries(operation.requestBody.content).map(([type, body]) => (
            <div key={type} className="mt-1">
              <code className="font-mono text-xs text-ink-muted">{type}</code>
              <SchemaView schema={body.schema} componentHref={schemaHref} />
            </div>
          ))}
        </div>
      ) : null}
      <div className="mt-3">
        <h4 className="text-xs font-medium tracking-wide text-ink-muted uppercase">Answers</h4>
        <ul>
          {Object.entries(operation.responses).map(([status, response]) => (
            <ResponseRow key={status} status={status} response={response} document={document} />
          ))}
        </ul>
      </div>
    </article>
  );
}

export function ApiReference({ document }: { document: ApiDocument }) {
  const operations = operationsOf(document);
  const server = document.servers[0]?.url ?? "";
  return (
    <div className="grid gap-8 xl:grid-cols-[16rem_1fr]">
      <nav aria-label="Operations" className="xl:sticky xl:top-4 xl:max-h-[calc(100vh-6rem)] xl:overflow-auto">
        {document.tags.map((tag) => (
          <div key={tag.name} className="mb-3">
            <a href={`#tag-${tag.name}`} className="text-sm font-semibold">
              {tag.name}
            </a>
            <ul className="mt-1 space-y-0.5">
              {operations
                .filter(({ operation }) => operation.tags.includes(tag.name))
                .map(({ path, method, operation }) => (
                  <li key={`${method} ${path}`}>
                    <a href={operationHref(operation)} className="flex items-center gap-2 text-xs hover:underline">
                      <span className="w-10 font-mono font-semibold text-ink-muted uppercase">{method}</span>
                      <span className="truncate font-mono" title={path}>
                        {path.replace("/api/v1", "")}
                      </span>
                    </a>
                  </li>
                ))}
            </ul>
          </div>
        ))}
        <a href="#schemas" className="text-sm font-semibold">
          Schemas
        </a>
      </nav>
      <div className="min-w-0 space-y-8">
        <section aria-labelledby="basics-heading" className="rounded-lg border border-line bg-surface p-5 text-sm">
          <h2 id="basics-heading" className="text-lg font-semibold">
            Basics
          </h2>
          <p className="mt-2">
            <Prose text={String(document.info.description ?? "")} />
          </p>
          <dl className="mt-3 grid grid-cols-[8rem_1fr] gap-x-4 gap-y-1">
            <dt className="text-ink-muted">Server</dt>
            <dd>
              <code className="font-mono">{server}</code>
            </dd>
            {Object.entries(document.components.securitySchemes).map(([name, scheme]) => (
              <div key={name} className="contents">
                <dt className="text-ink-muted">{scheme.type === "http" ? "Bearer token" : "Session"}</dt>
                <dd>
                  {scheme.type === "http" ? (
                    <code className="font-mono">Authorization: Bearer &lt;token&gt;</code>
                  ) : (
                    <code className="font-mono">Cookie: {scheme.name}=…</code>
                  )}{" "}
                  — {scheme.description}
                </dd>
              </div>
            ))}
            <dt className="text-ink-muted">Errors</dt>
            <dd>
              JSON <code className="font-mono">{"{ error: { code, message, details? } }"}</code> with 400, 401, 403, 404, 409, 413, 422 or 429 (see{" "}
              <a href={schemaHref("Error")} className="text-accent underline">
                Error
              </a>
              ).
            </dd>
            <dt className="text-ink-muted">Versions</dt>
            <dd>
              API {document.info.version}, exporter {String(document.info["x-exporter-version"])}, solver {String(document.info["x-solver-version"])}
            </dd>
          </dl>
        </section>
        {document.tags.map((tag) => (
          <section key={tag.name} aria-labelledby={`tag-${tag.name}`} className="space-y-4">
            <h2 id={`tag-${tag.name}`} className="scroll-mt-4 text-xl font-semibold">
              {tag.name} <span className="text-base font-normal text-ink-muted">— {tag.description}</span>
            </h2>
            {operations
              .filter(({ operation }) => operation.tags.includes(tag.name))
              .map(({ path, method, operation }) => (
                <OperationCard key={`${method} ${path}`} path={path} method={method} operation={operation} document={document} />
              ))}
          </section>
        ))}
        <section aria-labelledby="schemas" className="space-y-4">
          <h2 id="schemas" className="scroll-mt-4 text-xl font-semibold">
            Schemas
          </h2>
          {Object.entries(document.components.schemas).map(([name, schema]) => (
            <article key={name} id={`schema-${name}`} className="scroll-mt-4 rounded-lg border border-line bg-surface p-5">
              <h3 className="font-mono font-semibold">{name}</h3>
              {typeof schema.$id === "string" ? (
                <p className="text-xs text-ink-muted">
                  Published at{" "}
                  <a href={schema.$id} className="underline">
                    {schema.$id}
                  </a>
                </p>
              ) : null}
              <SchemaView schema={schema} componentHref={schemaHref} />
            </article>
          ))}
        </section>
      </div>
    </div>
  );
}
