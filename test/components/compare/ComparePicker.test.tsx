// @vitest-environment jsdom
// Issue 16, item 6: once A is picked, B offers only versions of A's robot's
// gaits, and a B of another robot is cleared with a sentence saying why.
import { cleanup, fireEvent, render, screen, within } from "@testing-library/react";
import { createRoutesStub } from "react-router";
import { afterEach, expect, test } from "vitest";
import { ComparePicker, type PickableVersion } from "~/components/compare/ComparePicker";

afterEach(cleanup);

const versions: PickableVersion[] = [
  { id: "a1", number: 1, message: "First", state: "released", gaitName: "Tripod cruise", robotName: "Pier crawler", robotId: "pier" },
  { id: "a2", number: 2, message: "Second", state: "committed", gaitName: "Tripod cruise", robotName: "Pier crawler", robotId: "pier" },
  { id: "q1", number: 1, message: "Trot", state: "released", gaitName: "Trot", robotName: "Quay walker", robotId: "quay" },
];

function renderPicker(a: string | null = null, b: string | null = null) {
  const Stub = createRoutesStub([{ path: "/", Component: () => <ComparePicker versions={versions} a={a} b={b} /> }]);
  return render(<Stub />);
}

const optionsOf = (select: HTMLElement) =>
  within(select)
    .getAllByRole("option")
    .filter((option) => (option as HTMLOptionElement).value !== "")
    .map((option) => (option as HTMLOptionElement).value);

test("B offers every version until A is picked, then only A's robot's", () => {
  renderPicker();
  const a = screen.getByRole("combobox", { name: "A" });
  const b = screen.getByRole("combobox", { name: "B" });
  expect(optionsOf(b)).toEqual(["a1", "a2", "q1"]);
  fireEvent.change(a, { target: { value: "a1" } });
  expect(optionsOf(b)).toEqual(["a1", "a2"]);
  expect(screen.getByTestId("picker-hint").textContent).toBe(
    "B lists the gaits of Pier crawler: versions of two robots cannot be compared, their legs and joints differ.",
  );
});

test("A changed to another robot clears B and says why", () => {
  renderPicker("a1", "a2");
  fireEvent.change(screen.getByRole("combobox", { name: "A" }), { target: { value: "q1" } });
  expect((screen.getByRole("combobox", { name: "B" }) as HTMLSelectElement).value).toBe("");
  expect(screen.getByTestId("picker-hint").textContent).toBe(
    "B was cleared: Tripod cruise v2 is a gait of Pier crawler, and versions of two robots cannot be compared. B lists the gaits of Quay walker.",
  );
});

test("a pair of two robots from the address starts with B cleared and the reason", () => {
  renderPicker("q1", "a1");
  expect((screen.getByRole("combobox", { name: "B" }) as HTMLSelectElement).value).toBe("");
  expect(screen.getByTestId("picker-hint").textContent).toMatch(/^B was cleared: Tripod cruise v1 is a gait of Pier crawler/);
});
