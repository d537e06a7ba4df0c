// The import rules of eslint.config.mjs carry the architecture (DEVELOPERS.md,
// "Rules of the house"): the pure core imports no React, router, database or
// app layer and reaches another core module only through its index;
// components and stores import no server module; a feature reaches another
// only through its index.ts or index.server.ts; a browser test imports the
// shared test of e2e/support/test.ts. Each snippet is linted as if
// it were the named file, so a rule that stops firing fails here.
import { fileURLToPath } from "node:url";
import { ESLint } from "eslint";
import { describe, expect, test } from "vitest";

const eslint = new ESLint({ cwd: fileURLToPath(new URL("../..", import.meta.url)) });

/** The import refusals (and any parse failure) for `code` linted as `filePath`. */
async function refusals(filePath: string, code: string): Promise<string[]> {
  const [result] = await eslint.lintText(code, { filePath });
  return result.messages.filter((message) => message.fatal || message.ruleId === "no-restricted-imports").map((message) => message.message);
}

describe("refused imports", () => {
  test.each([
    ["app/gait/x.ts", 'import { useState } from "react";', "no React"],
    ["app/gait/x.ts", 'import { createRoot } from "react-dom/client";', "no React"],
    ["app/gait/x.ts", 'import { redirect } from "react-router";', "no router"],
    ["app/kinematics/x.ts", 'import { eq } from "drizzle-orm";', "no database"],
    ["app/kinematics/x.ts", 'import { database } from "~/platform/db.server";', "app layer"],
    ["app/export/x.ts", 'import { robots } from "../../db/schema";', "no database"],
    ["app/export/x.ts", 'import { FLAG_LABELS } from "~/features/gaits";', "app layer"],
    ["app/export/x.ts", 'import { solveLeg } from "../kinematics/solve-leg";', "through its index"],
    ["app/gait/checks/x.ts", 'import { solveLeg } from "~/kinematics/solve-leg";', "through its index"],
    ["app/components/robots/X.tsx", 'import { getRobot } from "~/features/robots/robots.server";', "no *.server"],
    ["app/components/robots/X.tsx", 'import { robotOfRevision } from "~/features/robots/index.server";', "no *.server"],
    ["app/stores/x.ts", 'import { config } from "../platform/config.server";', "no *.server"],
    ["app/features/compare/x.ts", 'import { changedFields } from "~/features/robots/changes";', "through its index"],
    ["app/features/compare/x.ts", 'import { changedFields } from "../robots/changes";', "through its index"],
    ["app/features/compare/x.ts", 'export { changedFields } from "../robots/changes";', "through its index"],
    ["app/features/tables/x.ts", 'import { robotOfRevision } from "../robots/revision-robot.server";', "through its index"],
    ["app/features/api/operations/x.ts", 'import { draftSaveBody } from "../../gaits/drafts.server";', "through its index"],
    ["app/features/gaits/editor/x.ts", 'import { changedFields } from "~/features/robots/index/changes";', "through its index"],
    ["e2e/x.spec.ts", 'import { expect, test } from "@playwright/test";', "./support/test"],
  ])("%s: %s", async (filePath, code, saying) => {
    const found = await refusals(filePath, code);
    expect(found, `${code} in ${filePath}`).toHaveLength(1);
    expect(found[0]).toContain(saying);
  });
});

describe("allowed imports", () => {
  test.each([
    ["app/gait/x.ts", 'import { z } from "zod";'],
    ["app/gait/x.ts", 'import { parseRobot } from "../kinematics/index";'],
    ["app/export/x.ts", 'import { solveLeg } from "~/kinematics";'],
    ["app/gait/checks/x.ts", 'import { reach } from "../reach";'],
    ["app/components/robots/X.tsx", 'import { changedFields } from "~/features/robots";'],
    ["app/components/robots/X.tsx", 'import type { Robot } from "~/kinematics";'],
    ["app/routes/robots/x.tsx", 'import { getRobot } from "~/features/robots/robots.server";'],
    ["app/features/compare/x.ts", 'import { changedFields } from "~/features/robots";'],
    ["app/features/compare/x.ts", 'import { changedFields } from "~/features/robots/index";'],
    ["app/features/compare/x.ts", 'import { changedFields } from "../robots/index";'],
    ["app/features/compare/x.ts", 'import { changedFields } from "../robots";'],
    ["app/features/tables/x.ts", 'import { robotOfRevision } from "~/features/robots/index.server";'],
    ["app/features/tables/x.ts", 'import { robotOfRevision } from "../robots/index.server";'],
    ["app/features/api/operations/x.ts", 'import { draftSaveBody } from "../../gaits/index.server";'],
    ["app/features/robots/x.ts", 'import { changedFields } from "./changes";'],
    ["app/features/robots/x.ts", 'import { getRobot } from "~/features/robots/robots.server";'],
    ["app/features/gaits/editor/x.ts", 'import { FLAG_LABELS } from "../flag-labels";'],
    ["e2e/x.spec.ts", 'import { expect, test } from "./support/test";'],
    ["e2e/support/x.ts", 'import { test as base } from "@playwright/test";'],
  ])("%s: %s", async (filePath, code) => {
    expect(await refusals(filePath, code), `${code} in ${filePath}`).toEqual([]);
  });
});
