// @vitest-environment jsdom
// The API page renders the OpenAPI document readably: every operation with its
// method and path, who may call it, the table query's parameters, and the schemas.
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, test } from "vitest";
import { ApiReference, type ApiDocument } from "~/components/export/api-docs/ApiReference";
import { openApiDocument } from "~/features/api/openapi.server";
import { apiPermissions } from "~/routes/api.v1/permissions.server";

afterEach(cleanup);

const document = openApiDocument(apiPermissions()) as unknown as ApiDocument;

describe("ApiReference", () => {
  // Thirty-odd role queries, each working out every card's accessible name: over 5 s on a busy 2-core machine.
  test("one card per operation, with its method, path and summary", { timeout: 30_000 }, () => {
    render(<ApiReference document={document} />);
    for (const [path, methods] of Object.entries(document.paths)) {
      for (const [method, operation] of Object.entries(methods)) {
        const card = screen.getByRole("article", { name: new RegExp(`${method}\\s*${path.replace(/[{}]/g, "\\$&")}$`, "i") });
        expect(within(card).getByText(operation.summary)).toBeTruthy();
      }
    }
  });

  test("the table route lists its query parameters and the permission it needs", () => {
    render(<ApiReference document={document} />);
    const card = screen.getByRole("article", { name: /get\s*\/api\/v1\/gaits\/\{gaitId\}\/versions\/\{number\}\/table$/i });
    const parameters = within(card).getByRole("table");
    const names = within(parameters)
      .getAllByRole("row")
      .slice(1)
      .map((row) => within(row).getAllByRole("cell")[0].querySelector("code")?.textContent);
    expect(names).toEqual(["gaitId", "number", "format", "units", "rate", "profile", "override", "If-None-Match"]);
    expect(within(card).getByText("tables.download")).toBeTruthy();
    expect(within(card).getByText("304")).toBeTruthy();
  });

  test("public routes say so; the schemas section holds the robot schema's fields", () => {
    render(<ApiReference document={document} />);
    const card = screen.getByRole("article", { name: /get\s*\/api\/v1\/openapi\.json$/i });
    expect(within(card).getByText(/Public: no token or session needed/)).toBeTruthy();
    const robot = document.components.schemas.Robot as { properties: Record<string, unknown> };
    const section = window.document.getElementById("schema-Robot")!;
    for (const field of Object.keys(robot.properties)) expect(within(section).getAllByText(field).length).toBeGreaterThan(0);
  });
});
