// @vitest-environment jsdom
// Key details: the selected key's time, contact, foot, apex and easing, each
// committed on Enter as one undo step; presets and the curve's handles.
import { act, cleanup, fireEvent, screen } from "@testing-library/react";
import { afterEach, describe, expect, test } from "vitest";
import { KeyDetails } from "~/components/key-details/KeyDetails";
import { renderWithStore } from "../../support/editor";

afterEach(cleanup);

const field = (name: string) => screen.getByLabelText(name) as HTMLInputElement;
const type = (input: HTMLInputElement, value: string) => {
  fireEvent.change(input, { target: { value } });
  fireEvent.keyDown(input, { key: "Enter" });
};

describe("Key details", () => {
  test("asks for a selection first", () => {
    renderWithStore(<KeyDetails />);
    expect(screen.getByText("Select a key on the Timeline to see and change it.")).toBeTruthy();
  });

  test("shows the touch-down key of LF and moves it to a typed frame", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => store.getState().select({ legId: "LF", index: 1 }));
    expect(screen.getByText("LF · key 2 · touch-down")).toBeTruthy();
    expect(field("Frame").value).toBe("30");
    expect(screen.getByText("600 ms · t = 0.5000")).toBeTruthy();
    type(field("Frame"), "36");
    expect(store.getState().sequence.legs.LF.keys[1].t).toBeCloseTo(0.6, 9);
    expect(store.getState().past).toHaveLength(1);
  });

  test("a frame past the next key stops a frame short and says so", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => store.getState().select({ legId: "LF", index: 0 }));
    type(field("Frame"), "45");
    expect(store.getState().sequence.legs.LF.keys[0].t * 60).toBeCloseTo(29, 9);
    expect(store.getState().notice?.text).toBe("The key stops at frame 29, one frame from its neighbour.");
  });

  test("foot, apex and contact edits; a word where a number belongs is refused in place", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => store.getState().select({ legId: "LF", index: 0 }));
    type(field("Apex height (mm)"), "40");
    expect(store.getState().sequence.legs.LF.keys[0].apexMm).toBe(40);
    type(field("Foot y (mm)"), "130");
    expect(store.getState().sequence.legs.LF.keys[0].foot![1]).toBe(130);
    type(field("Foot x (mm)"), "far");
    expect(field("Foot x (mm)").getAttribute("aria-invalid")).toBe("true");
    expect(screen.getByText('"far" is not a number')).toBeTruthy();
    fireEvent.change(screen.getByLabelText("Contact from here"), { target: { value: "stance" } });
    expect(store.getState().sequence.legs.LF.keys[0].contact).toBe("stance");
  });

  test("easing: a named preset, typed control points, and the curve's handles on the arrow keys", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => store.getState().select({ legId: "LF", index: 0 }));
    const preset = screen.getByLabelText("Preset") as HTMLSelectElement;
    expect(preset.value).toBe("Soft");
    fireEvent.change(preset, { target: { value: "Cushioned" } });
    expect(store.getState().sequence.legs.LF.keys[0].ease).toEqual([0.42, 0, 0.58, 1]);
    type(field("Control y1"), "0.3");
    expect(store.getState().sequence.legs.LF.keys[0].ease).toEqual([0.42, 0.3, 0.58, 1]);
    expect((screen.getByLabelText("Preset") as HTMLSelectElement).value).toBe("");
    const first = screen.getByRole("slider", { name: "First control point (leaving the key)" });
    fireEvent.keyDown(first, { key: "ArrowRight", shiftKey: true });
    fireEvent.keyDown(first, { key: "ArrowUp" });
    expect(store.getState().sequence.legs.LF.keys[0].ease).toEqual([0.52, 0.31, 0.58, 1]);
    fireEvent.keyDown(first, { key: "ArrowRight", shiftKey: true });
    for (let i = 0; i < 6; i += 1) fireEvent.keyDown(first, { key: "ArrowRight", shiftKey: true });
    // x stays in [0, 1] so the curve remains a function of time.
    expect(store.getState().sequence.legs.LF.keys[0].ease![0]).toBe(1);
  });

  test("a lift-off key explains that its foot follows from the stance before it", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => store.getState().select({ legId: "LF", index: 0 }));
    expect(screen.getByText(/this key's foot follows from the touch-down before it/)).toBeTruthy();
    act(() => store.getState().select({ legId: "LF", index: 1 }));
    expect(screen.getByText("This key places the foot: drag it in the top view, or type it here.")).toBeTruthy();
  });

  test("body keys: pose offsets and resting", () => {
    const { store } = renderWithStore(<KeyDetails />);
    act(() => {
      store.getState().setFrame(12);
      store.getState().addKeyAtPlayhead(null);
    });
    expect(screen.getByText("Body · key 1")).toBeTruthy();
    type(field("Body pitch (°)"), "4");
    expect(store.getState().sequence.body.keys[0].pose.pitch).toBe(4);
    fireEvent.click(screen.getByLabelText(/Body rests on the ground/));
    expect(store.getState().sequence.body.keys[0].resting).toBe(true);
  });
});
