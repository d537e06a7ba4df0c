// @vitest-environment jsdom
import { cleanup, render, screen } from "@testing-library/react";
import { createRoutesStub, data, UNSAFE_ErrorResponseImpl as ErrorResponseImpl } from "react-router";
import { afterEach, describe, expect, test } from "vitest";
import { RouteErrorBoundary } from "~/components/common/ErrorPanel";

afterEach(cleanup);

function renderFailingRoute(fail: () => never) {
  const Stub = createRoutesStub([
    {
      path: "/",
      loader: fail,
      Component: () => null,
      HydrateFallback: () => null,
      // As a route module re-exports it: no props, the error read from the router.
      ErrorBoundary: () => <RouteErrorBoundary />,
    },
  ]);
  render(<Stub initialEntries={["/"]} />);
}

describe("ErrorPanel", () => {
  test("a 404 says there is no page and links home", async () => {
    renderFailingRoute(() => {
      throw data(null, { status: 404 });
    });
    expect(await screen.findByRole("heading", { name: "There is no page here" })).toBeTruthy();
    expect(screen.getByText("Error 404")).toBeTruthy();
    expect(screen.getByRole("link", { name: "Back to the start page" }).getAttribute("href")).toBe("/");
  });

  test("a 403 names the role problem and keeps the server's message", async () => {
    renderFailingRoute(() => {
      throw data({ message: "Viewers cannot edit robots." }, { status: 403 });
    });
    expect(await screen.findByRole("heading", { name: "Your role cannot do this" })).toBeTruthy();
    expect(screen.getByText("Viewers cannot edit robots.")).toBeTruthy();
  });

  test("a 410 says the link no longer works, with the server's reason, never the status text the framework gives it", async () => {
    renderFailingRoute(() => {
      throw data({ message: "This invitation link was already used." }, { status: 410, statusText: "Internal Server Error" });
    });
    expect(await screen.findByRole("heading", { name: "This link no longer works" })).toBeTruthy();
    expect(screen.getByText("This invitation link was already used.")).toBeTruthy();
    expect(screen.queryByText(/Internal Server Error/)).toBeNull();
  });

  test("a 405 says the page takes no form in our words, not the framework's text naming route modules", async () => {
    renderFailingRoute(() => {
      // What the framework throws for a POST to a route without an action.
      const text = 'You made a POST request to "/settings" but did not provide an `action` for route "routes/settings/layout"';
      throw new ErrorResponseImpl(405, "Method Not Allowed", new Error(text), true);
    });
    expect(await screen.findByRole("heading", { name: "This page takes no form" })).toBeTruthy();
    expect(screen.getByText(/nothing was changed/)).toBeTruthy();
    expect(screen.queryByText(/routes\/settings|action|Method Not Allowed/)).toBeNull();
  });

  test("a crash is a 500 that says nothing saved was lost", async () => {
    renderFailingRoute(() => {
      throw new Error("boom");
    });
    expect(await screen.findByRole("heading", { name: "Something broke on our side" })).toBeTruthy();
    expect(screen.getByText(/Nothing you saved was lost/)).toBeTruthy();
  });
});
