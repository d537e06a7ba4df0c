// @vitest-environment jsdom
import { cleanup, render, screen, within } from "@testing-library/react";
import { afterEach, describe, expect, test } from "vitest";
import { RobotViews } from "~/components/robot-view";
import { loadDemoRobot } from "../../support/robots";

afterEach(cleanup);

function numbersIn(container: Element): string[] {
  const values: string[] = [];
  for (const element of container.querySelectorAll("*")) {
    for (const name of ["d", "points", "x", "y", "x1", "y1", "x2", "y2", "cx", "cy", "transform", "width", "height"]) {
      const value = element.getAttribute(name);
      if (value !== null) values.push(value);
    }
  }
  return values;
}

describe("robot views", () => {
  test.each(["pier-crawler", "quay-walker", "hull-climber"] as const)("%s: a top and a side view with every leg and its reach ring, no NaN", (file) => {
    const robot = loadDemoRobot(file);
    const { container } = render(<RobotViews robot={robot} />);
    const top = screen.getByRole("img", { name: `Top view of ${robot.name}` });
    const side = screen.getByRole("img", { name: `Side view of ${robot.name}, from the right` });
    for (const view of [top, side]) {
      expect([...view.querySelectorAll("[data-leg]")].map((element) => element.getAttribute("data-leg")).sort()).toEqual(
        robot.legs.map((leg) => leg.id).sort(),
      );
    }
    expect(top.querySelectorAll("[data-ring]")).toHaveLength(robot.legs.length);
    expect(container.querySelectorAll("[data-flag]")).toHaveLength(0);
    expect(numbersIn(container).filter((value) => /NaN|Infinity/.test(value))).toEqual([]);
    const legend = screen.getByRole("list", { name: "Legs in the views" });
    expect(within(legend).getAllByRole("listitem")).toHaveLength(robot.legs.length);
    expect(top.querySelector("desc")?.textContent).toContain("Every foot is within reach and joint limits.");
  });

  test("a body too high for its legs: feet drawn as crosses, named in the description and the legend, still no NaN", () => {
    const robot = loadDemoRobot("quay-walker");
    const { container } = render(<RobotViews robot={robot} bodyHeightMm={400} />);
    expect(container.querySelectorAll("[data-flag]").length).toBe(robot.legs.length * 2);
    expect(screen.getByRole("img", { name: /Top view/ }).querySelector("desc")?.textContent).toContain("Out of reach or limits: LF, LR, RF, RR.");
    expect(screen.getAllByText("out of reach")).toHaveLength(robot.legs.length);
    expect(numbersIn(container).filter((value) => /NaN|Infinity/.test(value))).toEqual([]);
  });

  test("given angles are drawn as they are, without solving", () => {
    const robot = loadDemoRobot("quay-walker");
    const angles = Object.fromEntries(robot.legs.map((leg) => [leg.id, { coxa: 0, femur: 30, tibia: 0 }]));
    const { container } = render(<RobotViews robot={robot} angles={angles} showReach={false} compact />);
    expect(container.querySelectorAll("[data-ring]")).toHaveLength(0);
    expect(container.querySelectorAll("[data-leg]")).toHaveLength(robot.legs.length * 2);
    expect(screen.queryByRole("list", { name: "Legs in the views" })).toBeNull();
  });
});
