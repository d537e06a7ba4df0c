// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import axe from "axe-core";
import { createRoutesStub, useFetcher } from "react-router";
import { afterEach, describe, expect, test } from "vitest";
import { RobotEditor } from "~/components/robots/RobotForm";
import type { EditorMode } from "~/components/robots/robot-form-context";
import type { SaveResult } from "~/features/robots/results";
import { loadDemoRobot, type DemoRobotFile } from "../../support/robots";

afterEach(cleanup);

let lastPost: FormData | null = null;

function renderEditor(mode: EditorMode, file: DemoRobotFile = "pier-crawler") {
  const robot = loadDemoRobot(file);
  lastPost = null;
  const Stub = createRoutesStub([
    {
      path: "/robots/:robotId",
      Component: function Page() {
        const saveFetcher = useFetcher<SaveResult>();
        return <RobotEditor robotId="r1" initial={robot} baseRevision={3} mode={mode} saveFetcher={saveFetcher} />;
      },
      action: async ({ request }) => {
        lastPost = await request.formData();
        return { ok: true, number: 4, message: "saved" };
      },
    },
  ]);
  const view = render(<Stub initialEntries={["/robots/r1"]} />);
  return { robot, ...view };
}

const field = (name: string) => screen.getByRole("textbox", { name }) as HTMLInputElement;

// The whole form renders in jsdom, which takes a while on a busy machine.
describe("robot editor", { timeout: 30_000 }, () => {
  test("a bad value shows parseRobot's message next to the field and in the summary, and blocks Save", async () => {
    renderEditor("edit");
    const femur = field("LF femur length (mm)");
    expect(femur.value).toBe("60");
    expect(screen.getByRole("button", { name: "Save as revision 4" })).toHaveProperty("disabled", true);

    fireEvent.change(femur, { target: { value: "-5" } });
    expect(femur.getAttribute("aria-invalid")).toBe("true");
    const message = document.getElementById(femur.getAttribute("aria-describedby")!);
    expect(message?.textContent).toBe("⚠ must be at least 1 (got -5)");
    const summary = screen.getByRole("region", { name: "Problems" });
    expect(within(summary).getByText("1 problem to fix before saving")).toBeTruthy();
    // The summary names the field as people read it, not by its path.
    expect(within(summary).getByRole("link", { name: "Leg LF, femur length must be at least 1 (got -5)" }).getAttribute("href")).toBe(`#${femur.id}`);
    expect(within(summary).queryByText(/legs\[0\]/)).toBeNull();
    expect(screen.getByRole("button", { name: "Save as revision 4" })).toHaveProperty("disabled", true);
    expect(screen.getByText(/The views show the last valid definition/)).toBeTruthy();

    fireEvent.change(femur, { target: { value: "abc" } });
    expect(document.getElementById(femur.getAttribute("aria-describedby")!)?.textContent).toBe('⚠ must be a number (got "abc")');

    fireEvent.change(femur, { target: { value: "64.5" } });
    expect(femur.getAttribute("aria-invalid")).toBeNull();
    expect(screen.queryByRole("region", { name: "Problems" })).toBeNull();
    expect(screen.getByRole("button", { name: "Save as revision 4" })).toHaveProperty("disabled", false);
  });

  test("rules across fields land on the field they name: a minimum above the maximum", () => {
    renderEditor("edit");
    const minimum = field("LM femur minimum (servo degrees)");
    fireEvent.change(minimum, { target: { value: "120" } });
    expect(document.getElementById(minimum.getAttribute("aria-describedby")!)?.textContent).toMatch(/must be below the maximum \(got 120 ≥ 85\)/);
  });

  test("Save posts the whole definition with its base revision and message", async () => {
    renderEditor("edit");
    fireEvent.change(field("LF tibia length (mm)"), { target: { value: "104" } });
    fireEvent.change(screen.getByRole("textbox", { name: "What changed (optional)" }), { target: { value: "Longer tibia" } });
    fireEvent.click(screen.getByRole("button", { name: "Save as revision 4" }));
    await waitFor(() => expect(lastPost).not.toBeNull());
    expect(lastPost!.get("intent")).toBe("save");
    expect(lastPost!.get("baseRevision")).toBe("3");
    expect(lastPost!.get("message")).toBe("Longer tibia");
    const sent = JSON.parse(String(lastPost!.get("definition")));
    expect(sent.legs[0].tibia).toBe(104);
    expect(sent.legs[1]).toEqual(loadDemoRobot("pier-crawler").legs[1]);
  });

  test("mirror left → right copies an edited left leg onto its right counterpart", () => {
    renderEditor("edit");
    fireEvent.change(field("LF coxa length (mm)"), { target: { value: "33" } });
    fireEvent.click(screen.getByRole("button", { name: "Mirror left → right" }));
    expect(field("RF coxa length (mm)").value).toBe("33");
    expect(screen.getByText(/Mirrored the left legs onto the right side: replaced RF, RM, RR/)).toBeTruthy();
  });

  test("copy a leg to others", () => {
    renderEditor("edit", "quay-walker");
    fireEvent.change(field("LF femur length (mm)"), { target: { value: "90" } });
    fireEvent.click(screen.getByRole("button", { name: "Copy" }));
    for (const id of ["LR", "RF", "RR"]) expect(field(`${id} femur length (mm)`).value).toBe("90");
  });

  test("firmware: only zero offsets and servo fields can be changed, and no leg tools", () => {
    renderEditor("calibrate");
    expect(field("LF femur length (mm)").readOnly).toBe(true);
    expect(field("LF femur minimum (servo degrees)").readOnly).toBe(true);
    expect(field("LF femur zero offset (degrees)").readOnly).toBe(false);
    expect(field("LF femur servo centre (µs)").readOnly).toBe(false);
    expect(screen.queryByRole("button", { name: "Mirror left → right" })).toBeNull();
    expect(screen.getByText(/As firmware you can change/)).toBeTruthy();
  });

  test("read only: no save bar, every field read-only", () => {
    renderEditor("read");
    expect(screen.queryByRole("button", { name: /Save as revision/ })).toBeNull();
    for (const input of screen.getAllByRole("textbox")) expect((input as HTMLInputElement).readOnly).toBe(true);
  });

  test("the rest pose can be switched off and on", () => {
    renderEditor("edit");
    const toggle = screen.getByRole("checkbox", { name: /This robot has a rest pose/ });
    expect(field("LF rest femur (servo degrees)")).toBeTruthy();
    fireEvent.click(toggle);
    expect(screen.queryByRole("textbox", { name: "LF rest femur (servo degrees)" })).toBeNull();
    fireEvent.click(toggle);
    expect(field("LF rest femur (servo degrees)").value).toBe("0");
  });

  test("axe finds no violations in the editor and its views", async () => {
    const { container } = renderEditor("edit", "quay-walker");
    // Contrast needs real layout, which jsdom has not; the browser tests run axe with it.
    const results = await axe.run(container, { rules: { "color-contrast": { enabled: false } } });
    expect(results.violations.map((violation) => `${violation.id}: ${violation.nodes.length} × ${violation.nodes[0]?.html}`)).toEqual([]);
  });
});
