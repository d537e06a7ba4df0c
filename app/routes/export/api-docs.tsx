// /api-docs: the OpenAPI document of /api/v1, readable. Public, like the document itself.
import type { Route } from "./+types/api-docs";
import { ErrorPanel } from "~/components/common/ErrorPanel";
import { PageHeader } from "~/components/common/PageHeader";
import { ApiReference, type ApiDocument } from "~/components/export/api-docs/ApiReference";
import { openApiDocument } from "~/features/api/openapi.server";
import { apiPermissions } from "~/routes/api.v1/permissions.server";
import type { RoutePermissions } from "~/platform/permissions";

export const permissions = { loader: "public" } satisfies RoutePermissions;

export function loader(_: Route.LoaderArgs) {
  return { document: openApiDocument(apiPermissions()) as unknown as ApiDocument };
}

export const meta: Route.MetaFunction = () => [{ title: "API · Gaitloom" }];

export default function ApiDocs({ loaderData }: Route.ComponentProps) {
  const { document } = loaderData;
  return (
    <>
      <PageHeader title={document.info.title} lead={document.info.summary}>
        <a href="/api/v1/openapi.json" className="rounded-md border border-line px-3 py-2 text-sm hover:bg-sunken">
          openapi.json
        </a>
      </PageHeader>
      <ApiReference document={document} />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPanel error={error} />;
}
