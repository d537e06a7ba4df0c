// A stored robot revision that no longer parses is one answer wherever it is
// met: 409 revision-unparseable, naming the revision (and the version that
// pins it), with what to do about it.
import { describe, expect, test } from "vitest";
import { robotOfRevision } from "~/features/robots/revision-robot.server";
import { ServiceError } from "~/platform/errors.server";
import pierCrawler from "../../../db/demo/robots/pier-crawler.json";

const refusal = (run: () => unknown): ServiceError => {
  try {
    run();
  } catch (error) {
    if (error instanceof ServiceError) return error;
    throw error;
  }
  throw new Error("expected a refusal");
};

describe("robotOfRevision", () => {
  test("a definition that parses is the robot", () => {
    expect(robotOfRevision({ number: 2, definition: structuredClone(pierCrawler) }).name).toBe(pierCrawler.name);
  });

  test("one that no longer parses: 409 revision-unparseable with the revision, the remedy and the field", () => {
    const error = refusal(() =>
      robotOfRevision({ number: 4, definition: { legs: "none" } }, { robotName: "Quay walker", remedy: "fix the robot first", field: "robotId" }),
    );
    expect(error).toMatchObject({ status: 409, code: "revision-unparseable", details: { robotRevision: 4, field: "robotId" } });
    expect(error.message).toBe("Robot revision 4 of Quay walker no longer parses; fix the robot first.");
  });

  test("through a gait version: the sentence names the version that pins it", () => {
    const error = refusal(() => robotOfRevision({ number: 4, definition: null }, { version: 7 }));
    expect(error.message).toBe("Version 7 pins robot revision 4, which no longer parses.");
    expect(error.status).toBe(409);
  });
});
