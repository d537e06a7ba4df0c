// @vitest-environment jsdom
// Issue 16, item 6: the compare page's joint plots shade the joint limits and
// mark flagged frames as the editor's plots do (the same plot parts).
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, expect, test } from "vitest";
import { JointOverlayPlots } from "~/components/compare/JointOverlayPlots";
import { jointOverlays } from "~/features/compare";
import type { Flag } from "~/gait";

afterEach(cleanup);

const frames = (angles: number[]) => angles.map((femur) => ({ legs: { LF: { angles: { coxa: 0, femur, tibia: -30 } } } }));
const flag = (frame: number, kind: Flag["kind"], joint?: Flag["joint"]): Flag => ({
  frame,
  kind,
  leg: "LF",
  joint,
  severity: "error",
  value: 0,
  limit: 0,
  message: `${kind} at frame ${frame}`,
});

test("limit bands past the joint's limits and a mark at each flagged frame of A and of B, each with its title", () => {
  const limits = { LF: { coxa: { minDeg: -40, maxDeg: 40 }, femur: { minDeg: -10, maxDeg: 50 }, tibia: { minDeg: -90, maxDeg: 0 } } };
  const overlays = jointOverlays(
    { loop: true, frames: frames([0, 20, 45, 20]), flags: [flag(2, "joint-limit", "femur")], limits },
    { loop: true, frames: frames([0, 30, 55, 30]), flags: [flag(2, "joint-limit", "femur"), flag(3, "unreachable")], limits },
  );
  const femur = overlays.find((overlay) => overlay.joint === "femur")!;
  expect(femur.limits).toEqual({ minDeg: -10, maxDeg: 50 });
  expect(femur.flags.a.map((mark) => [mark.fraction, mark.kind])).toEqual([[0.5, "joint-limit"]]);
  expect(femur.flags.b.map((mark) => [mark.fraction, mark.kind])).toEqual([
    [0.5, "joint-limit"],
    [0.75, "unreachable"],
  ]);
  const { container } = render(<JointOverlayPlots overlays={overlays} fraction={0} labels={{ a: "Walk v1", b: "Walk v2" }} />);
  const plot = screen.getByRole("img", { name: /^LF femur/ });
  expect(plot.querySelectorAll("[data-limit-band]").length).toBeGreaterThan(0);
  const marks = [...plot.querySelectorAll("[data-flag-mark]")];
  expect(marks.map((mark) => mark.getAttribute("data-flag-mark"))).toEqual(["a:joint-limit", "b:joint-limit", "b:unreachable"]);
  expect(marks[0].querySelector("title")?.textContent).toBe("A: Joint past its limit, frame 2");
  expect(container.textContent).toContain("shaded: past the joint limits");
});
