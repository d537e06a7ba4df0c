import { describe, expect, test } from "vitest";
import { versionStateEnum } from "../../../db/schema";
import { STATE_LABELS, VERSION_STATES, stateWord } from "~/features/versions/state-labels";

describe("the review states and their names", () => {
  test("every state of the database enum, in the order of a version's life", () => {
    expect(VERSION_STATES).toEqual([...versionStateEnum.enumValues]);
  });
  test("a label for badges, a word for sentences", () => {
    expect(STATE_LABELS["sent-back"]).toBe("Sent back");
    expect(stateWord("in-review")).toBe("in review");
  });
});
