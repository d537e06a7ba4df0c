// The three invented demo robots of db/demo/robots, parsed once for the tests.
import { readFileSync } from "node:fs";
import { fileURLToPath } from "node:url";
import { parseRobot, type Robot } from "../../../app/kinematics";

export const DEMO_ROBOT_FILES = ["pier-crawler", "quay-walker", "hull-climber"] as const;

export function demoRobotJson(file: (typeof DEMO_ROBOT_FILES)[number]): unknown {
  return JSON.parse(readFileSync(fileURLToPath(new URL(`../../../db/demo/robots/${file}.json`, import.meta.url)), "utf8"));
}

export function loadDemoRobots(): Robot[] {
  return DEMO_ROBOT_FILES.map((file) => {
    const parsed = parseRobot(demoRobotJson(file));
    if (!parsed.ok) throw new Error(`${file}.json does not parse: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
    return parsed.robot;
  });
}

export function fixtureText(name: string): string {
  return readFileSync(fileURLToPath(new URL(`../fixtures/${name}`, import.meta.url)), "utf8");
}
