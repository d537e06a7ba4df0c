// @vitest-environment jsdom
import { cleanup, render, screen } from "@testing-library/react";
import { afterEach, describe, expect, it } from "vitest";
import { OverrideField, ProfileField, QueryNumberField } from "~/components/export/TableFormatFields";

afterEach(cleanup);

describe("the fields both angle-table forms share", () => {
  it("offers the robot definition first, then each profile with its revision, the chosen one selected", () => {
    render(
      <ProfileField
        idPrefix="export"
        profiles={[
          { name: "bench rig", revision: 3 },
          { name: "field", revision: 1 },
        ]}
        value="field"
        resetKey="g1"
      />,
    );
    const select = screen.getByLabelText("Calibration profile") as HTMLSelectElement;
    expect(select.name).toBe("profile");
    expect(Array.from(select.options, (option) => option.textContent)).toEqual(["None — the robot definition", "bench rig (revision 3)", "field (revision 1)"]);
    expect(select.value).toBe("field");
  });

  it("marks and focuses the override reason when a table was refused for want of one, with its help text", () => {
    render(<OverrideField idPrefix="bench" value={null} needed help="Only when the checks find errors." />);
    const input = screen.getByLabelText("Override reason") as HTMLInputElement;
    expect(input.name).toBe("override");
    expect(input.getAttribute("aria-invalid")).toBe("true");
    expect(document.activeElement).toBe(input);
    expect(screen.getByText("Only when the checks find errors.").id).toBe(input.getAttribute("aria-describedby"));
  });

  it("leaves the override reason unmarked otherwise", () => {
    render(<OverrideField idPrefix="export" value="legs free on the stand" help="Written into the header." />);
    const input = screen.getByLabelText("Override reason") as HTMLInputElement;
    expect(input.value).toBe("legs free on the stand");
    expect(input.hasAttribute("aria-invalid")).toBe(false);
  });

  it("gives a number field its bounds and describes it by its help text when it has one", () => {
    render(<QueryNumberField id="x-speed" name="speed" label="Speed" min="0.01" max="10" value="" invalid help="A fraction of the joint's limit." />);
    const input = screen.getByLabelText("Speed") as HTMLInputElement;
    expect([input.name, input.type, input.step, input.min, input.max]).toEqual(["speed", "number", "any", "0.01", "10"]);
    expect(input.getAttribute("aria-invalid")).toBe("true");
    expect(screen.getByText("A fraction of the joint's limit.").id).toBe(input.getAttribute("aria-describedby"));
  });

  it("leaves a number field without help undescribed and unmarked", () => {
    render(<QueryNumberField id="bench-dwell" name="dwell" label="Pause at each end (ms)" step="1" min="0" max="10000" value={250} />);
    const input = screen.getByLabelText("Pause at each end (ms)") as HTMLInputElement;
    expect(input.value).toBe("250");
    expect(input.hasAttribute("aria-describedby") || input.hasAttribute("aria-invalid")).toBe(false);
  });
});
