// @vitest-environment jsdom
// Leaving the robot page with unsaved edits asks first: stay keeps every edit,
// leave goes on; without edits, or after discarding them, links just go.
import { cleanup, fireEvent, render, screen } from "@testing-library/react";
import { createRoutesStub, Link, useFetcher } from "react-router";
import { afterEach, beforeAll, describe, expect, test } from "vitest";
import { RobotEditor } from "~/components/robots/RobotForm";
import type { SaveResult } from "~/features/robots/results";
import { loadDemoRobot } from "../../support/robots";

afterEach(cleanup);

beforeAll(() => {
  // jsdom has <dialog> but not its modal methods.
  HTMLDialogElement.prototype.showModal ??= function (this: HTMLDialogElement) {
    this.open = true;
  };
  HTMLDialogElement.prototype.close ??= function (this: HTMLDialogElement) {
    this.open = false;
    this.dispatchEvent(new Event("close"));
  };
});

function renderPage() {
  const robot = loadDemoRobot("pier-crawler");
  const Stub = createRoutesStub([
    {
      path: "/robots/:robotId",
      Component: function Page() {
        const saveFetcher = useFetcher<SaveResult>();
        return (
          <>
            <Link to="/gaits">Gaits</Link>
            <RobotEditor robotId="r1" initial={robot} baseRevision={3} mode="edit" saveFetcher={saveFetcher} />
          </>
        );
      },
    },
    { path: "/gaits", Component: () => <h1>The gaits</h1> },
  ]);
  render(<Stub initialEntries={["/robots/r1"]} />);
}

const femur = () => screen.getByRole("textbox", { name: "LF femur length (mm)" }) as HTMLInputElement;
const question = () => screen.queryByRole("dialog", { name: "Leave without saving?" });

describe("leaving the robot form", { timeout: 30_000 }, () => {
  test("without edits, a link just goes", async () => {
    renderPage();
    fireEvent.click(screen.getByRole("link", { name: "Gaits" }));
    expect(await screen.findByRole("heading", { name: "The gaits" })).toBeTruthy();
  });

  test("with edits, a link asks; staying keeps the edits, leaving goes on", async () => {
    renderPage();
    fireEvent.change(femur(), { target: { value: "64" } });
    fireEvent.click(screen.getByRole("link", { name: "Gaits" }));
    expect(await screen.findByRole("dialog", { name: "Leave without saving?" })).toBeTruthy();
    expect(screen.queryByRole("heading", { name: "The gaits" })).toBeNull();

    fireEvent.click(screen.getByRole("button", { name: "Stay on this robot" }));
    expect(question()).toBeNull();
    expect(femur().value).toBe("64");

    fireEvent.click(screen.getByRole("link", { name: "Gaits" }));
    fireEvent.click(await screen.findByRole("button", { name: "Leave and lose the changes" }));
    expect(await screen.findByRole("heading", { name: "The gaits" })).toBeTruthy();
  });

  test("after discarding the edits, a link just goes", async () => {
    renderPage();
    fireEvent.change(femur(), { target: { value: "64" } });
    fireEvent.click(screen.getByRole("button", { name: "Discard changes" }));
    fireEvent.click(screen.getByRole("link", { name: "Gaits" }));
    expect(await screen.findByRole("heading", { name: "The gaits" })).toBeTruthy();
  });
});
