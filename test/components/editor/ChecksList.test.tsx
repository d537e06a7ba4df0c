// @vitest-environment jsdom
// Checks: the runs of flags from the server's reference or the browser
// preview, labelled as which is which, each jumping to its frame.
import { act, cleanup, fireEvent, screen, within } from "@testing-library/react";
import { afterEach, expect, test } from "vitest";
import { ChecksList } from "~/components/editor/ChecksList";
import type { useServerReference } from "~/components/editor/use-server-reference";
import { EditorStoreProvider } from "~/stores/editor-context";
import { renderWithStore } from "../../support/editor";

afterEach(cleanup);

type Reference = ReturnType<typeof useServerReference>;
const reference = (data: Partial<Reference>): Reference =>
  ({ data: undefined, isError: false, error: null, isFetching: false, current: true, ...data }) as unknown as Reference;

test("with no server answer yet the list says so and shows the preview's flags", () => {
  const { store } = renderWithStore(<ChecksList reference={reference({})} />);
  expect(screen.getByTestId("checks-status").textContent).toBe("Asking the server for its reference check…");
  expect(screen.getByTestId("checks-count").textContent).toBe("Preview: no flags — every frame passes every check.");
  act(() => store.getState().moveKey({ legId: "LF", index: 1 }, 40 / 60));
  // Issue 16: frames counted as frames, flags as flags.
  expect(screen.getByTestId("checks-count").textContent).toBe("Preview: 10 frames with errors, 0 with warnings (10 flags) in 1 run.");
});

test("the server's reference, labelled; agreeing with the preview or not; a run moves the playhead", () => {
  const { store, rerender: rerenderTree } = renderWithStore(<ChecksList reference={reference({})} />);
  const rerender = (ui: React.ReactNode) => rerenderTree(<EditorStoreProvider store={store}>{ui}</EditorStoreProvider>);
  act(() => store.getState().moveKey({ legId: "LF", index: 1 }, 40 / 60));
  const flags = store.getState().preview!.flags;
  const agreeing = reference({ data: { version: store.getState().sequenceVersion, flags, summary: store.getState().preview!.summary, solvedAt: 0 } });
  rerender(<ChecksList reference={agreeing} />);
  expect(screen.getByTestId("checks-status").textContent).toBe("Server reference agrees with the browser preview.");
  expect(screen.getByTestId("checks-count").textContent).toMatch(/^Server: /);
  const list = screen.getByRole("list", { name: "Flags (server reference)" });
  const run = within(list).getByRole("button", { name: /Error · Too few feet down · body · frames 30–39/ });
  fireEvent.click(run);
  expect(store.getState().frame).toBe(30);

  rerender(<ChecksList reference={reference({ data: { ...agreeing.data!, flags: flags.slice(1) } })} />);
  expect(screen.getByTestId("checks-status").textContent).toBe(
    `Server reference differs from the browser preview (server ${flags.length - 1} flags, preview ${flags.length}).`,
  );
  fireEvent.click(screen.getByRole("radio", { name: "Browser preview" }));
  expect(screen.getByRole("list", { name: "Flags (browser preview)" })).toBeTruthy();
});

test("a failed server check is said plainly", () => {
  renderWithStore(<ChecksList reference={reference({ isError: true, error: new Error("The server answered 500.") } as Partial<Reference>)} />);
  expect(screen.getByTestId("checks-status").textContent).toBe("The server check failed (The server answered 500.); showing what it last said.");
});
