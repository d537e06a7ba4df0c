// @vitest-environment jsdom
// Joint plots: three curves for the focused leg with their limits and speeds
// named, a playhead that follows the store, and curves that follow edits.
import { act, cleanup, screen } from "@testing-library/react";
import { afterEach, expect, test } from "vitest";
import { jointSeries } from "~/components/joint-plots/joint-series";
import { JointPlots } from "~/components/joint-plots/JointPlots";
import { renderWithStore } from "../../support/editor";

afterEach(cleanup);

test("coxa, femur and tibia of the focused leg, described with range, limits and peak speed", () => {
  const { store } = renderWithStore(<JointPlots />);
  const plots = screen.getAllByRole("img");
  expect(plots).toHaveLength(3);
  const femur = jointSeries(store.getState().preview!, "LF", true)[1];
  expect(plots[1].getAttribute("aria-label")).toBe(
    `LF femur: from ${femur.minAngleDeg.toFixed(1)}° to ${femur.maxAngleDeg.toFixed(1)}° over the cycle, limits ${store.getState().robot.legs[0].joints.femur.minDeg}° to ${store.getState().robot.legs[0].joints.femur.maxDeg}°; peak speed ${Math.round(femur.peakSpeedDegS)}°/s of ${store.getState().robot.legs[0].joints.femur.maxSpeedDegS}°/s.`,
  );
  act(() => store.getState().focusLeg("RR"));
  expect(screen.getAllByRole("img")[0].getAttribute("aria-label")).toMatch(/^RR coxa: /);
});

test("the playhead line follows the frame without redrawing the curves; an edit redraws them", () => {
  const { store, container } = renderWithStore(<JointPlots />);
  const curve = () => container.querySelector('svg[data-joint="femur"] path:last-of-type')!.getAttribute("d");
  const before = curve();
  act(() => store.getState().setFrame(25));
  expect([...container.querySelectorAll("[data-playhead]")].map((line) => line.getAttribute("data-playhead"))).toEqual(["25", "25", "25"]);
  expect(curve()).toBe(before);
  act(() => store.getState().moveKey({ legId: "LF", index: 1 }, 0.7));
  expect(curve()).not.toBe(before);
});

test("joint speed is the change from the frame before times the frame rate, round the seam of a loop", () => {
  const { store } = renderWithStore(<JointPlots />);
  const preview = store.getState().preview!;
  const [coxa] = jointSeries(preview, "LF", true);
  const n = preview.frames.length;
  expect(coxa.speedDegS[0]).toBeCloseTo(Math.abs(coxa.angleDeg[0] - coxa.angleDeg[n - 1]) * 50, 9);
  expect(coxa.speedDegS[10]).toBeCloseTo(Math.abs(coxa.angleDeg[10] - coxa.angleDeg[9]) * 50, 9);
  // The engine's own summary agrees on the peak, °/s.
  expect(coxa.peakSpeedDegS).toBeCloseTo(preview.summary.peakSpeedDegS.LF.coxa, 6);
});
