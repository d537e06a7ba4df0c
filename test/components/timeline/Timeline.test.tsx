// @vitest-environment jsdom
// The Timeline: a track per leg (left front to back, then right) and the
// body, stance bars from the preview, key markers named for screen readers,
// flags on their tracks, and the ruler as the playhead's slider.
import { act, cleanup, fireEvent, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, test } from "vitest";
import { Timeline } from "~/components/timeline/Timeline";
import { tickStep } from "~/components/timeline/TimeRuler";
import { renderWithStore } from "../../support/editor";

afterEach(cleanup);

describe("Timeline", () => {
  test("tracks in gait-diagram order, with the tripod's stance bars and keys", () => {
    const { container } = renderWithStore(<Timeline />);
    const tracks = [...container.querySelectorAll("[data-track]")].map((track) => track.getAttribute("data-track"));
    expect(tracks).toEqual(["LF", "LM", "LR", "RF", "RM", "RR", "body"]);
    // LF: swing 0–30, stance 30–60 of 60 frames; LM the other way round.
    expect([...container.querySelectorAll('[data-track="LF"] [data-stance]')].map((bar) => bar.getAttribute("data-stance"))).toEqual(["30-60"]);
    expect([...container.querySelectorAll('[data-track="LM"] [data-stance]')].map((bar) => bar.getAttribute("data-stance"))).toEqual(["0-30"]);
    expect(screen.getByRole("button", { name: "LF key 1 of 2, lift-off at frame 0 (0 ms)" })).toBeTruthy();
    expect(screen.getByRole("button", { name: "LF key 2 of 2, touch-down at frame 30 (600 ms)" })).toBeTruthy();
  });

  test("clicking a key selects it and brings the playhead to its frame", () => {
    const { store } = renderWithStore(<Timeline />);
    const key = screen.getByRole("button", { name: /^RM key 2 of 2/ });
    fireEvent.click(key);
    expect(store.getState().selection).toEqual({ legId: "RM", index: 1 });
    expect(store.getState().frame).toBe(30);
    expect(key.getAttribute("aria-pressed")).toBe("true");
    expect(screen.getByRole("slider", { name: "Playhead" }).getAttribute("aria-valuenow")).toBe("30");
  });

  test("the ruler moves the playhead with the arrow keys (Shift: ten frames), Home and End", () => {
    const { store } = renderWithStore(<Timeline />);
    const ruler = screen.getByRole("slider", { name: "Playhead" });
    fireEvent.keyDown(ruler, { key: "ArrowRight" });
    fireEvent.keyDown(ruler, { key: "ArrowRight", shiftKey: true });
    expect(store.getState().frame).toBe(11);
    expect(ruler.getAttribute("aria-valuetext")).toBe("frame 11 of 60, 220 ms");
    fireEvent.keyDown(ruler, { key: "End" });
    expect(store.getState().frame).toBe(59);
    fireEvent.keyDown(ruler, { key: "Home" });
    expect(store.getState().frame).toBe(0);
  });

  test("flags appear on their tracks by shape and text: a shortened stance puts ▲ feet on the body track", () => {
    const { store, container } = renderWithStore(<Timeline />);
    act(() => store.getState().moveKey({ legId: "LF", index: 1 }, 40 / 60));
    const flag = container.querySelector('[data-track="body"] [data-flag-kind="support-count"]')!;
    expect(flag.textContent).toBe("▲ feet");
    expect(flag.getAttribute("data-from")).toBe("30");
    expect(flag.getAttribute("data-to")).toBe("39");
    expect(flag.getAttribute("title")).toMatch(/^Too few feet down, frames 30–39: /);
  });

  test("keys show a focus ring: no key button takes the outline away (issue 16)", () => {
    const { container } = renderWithStore(<Timeline />);
    const keys = container.querySelectorAll("[data-key]");
    expect(keys.length).toBeGreaterThan(0);
    for (const key of keys) {
      expect(key.className, key.getAttribute("aria-label") ?? "").not.toMatch(/(^| )outline-none( |$)/);
      expect(key.className).toMatch(/focus-visible:/);
    }
    expect(container.textContent).toContain("Drag keys to move them");
  });

  test("key commands act on the selection and say when they cannot", () => {
    const { store } = renderWithStore(<Timeline />);
    const tools = screen.getByRole("toolbar", { name: "Key commands" });
    expect(within(tools).getByRole("button", { name: "Delete key" }).hasAttribute("disabled")).toBe(true);
    fireEvent.click(screen.getByRole("button", { name: /^LF key 1 of 2/ }));
    fireEvent.click(within(tools).getByRole("button", { name: "Duplicate key" }));
    expect(store.getState().sequence.legs.LF.keys.map((key) => Math.round(key.t * 60))).toEqual([0, 15, 30]);
    fireEvent.click(within(tools).getByRole("button", { name: "Mirror LF onto RF" }));
    expect(store.getState().sequence.legs.RF.keys).toHaveLength(3);
  });

  test("a read-only timeline has no key commands, and its keys still select", () => {
    const { store, container } = renderWithStore(<Timeline />, { readOnly: true });
    expect(screen.queryByRole("toolbar", { name: "Key commands" })).toBeNull();
    // Issue 16: it does not invite a drag it will not do.
    expect(container.textContent).not.toMatch(/drag keys/i);
    expect(container.textContent).toContain("Click a key to see its details; your role cannot move keys.");
    fireEvent.click(screen.getByRole("button", { name: /^LF key 2 of 2/ }));
    expect(store.getState().selection).toEqual({ legId: "LF", index: 1 });
  });
});

test("ruler ticks: at most the asked number of labels, in steps of 1, 2, 5, 10, 20, 25, 50 …", () => {
  expect(tickStep(60, 6)).toBe(10);
  expect(tickStep(60, 10)).toBe(10);
  expect(tickStep(1000, 8)).toBe(200);
  expect(tickStep(12, 8)).toBe(2);
});
