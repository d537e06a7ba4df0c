// @vitest-environment jsdom
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, test } from "vitest";
import { FramedTable } from "~/components/common/FramedTable";

afterEach(cleanup);

describe("FramedTable", () => {
  test("names the table, heads its columns in order, right-aligning those that hold numbers, and holds the rows given", () => {
    render(
      <FramedTable label="Metric deltas, B against A" columns={[{ label: "Metric" }, { label: "A", align: "right" }]}>
        <tr>
          <td>Cycle</td>
          <td>1200</td>
        </tr>
      </FramedTable>,
    );
    const table = screen.getByRole("table", { name: "Metric deltas, B against A" });
    const headings = within(table).getAllByRole("columnheader");
    expect(headings.map((heading) => heading.textContent)).toEqual(["Metric", "A"]);
    expect(headings.map((heading) => heading.classList.contains("text-right"))).toEqual([false, true]);
    expect(within(table).getByRole("cell", { name: "1200" })).toBeTruthy();
  });
});
