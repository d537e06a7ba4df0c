// The robots tests use: the three invented demo robots of db/demo/robots,
// parsed as the app parses an upload, and the hand-made robot files of
// test/kinematics/fixtures (the URDF import's test crab). Imported rather than
// read from disk, so they load the same under jsdom as under node.
import hullClimber from "../../db/demo/robots/hull-climber.json";
import pierCrawler from "../../db/demo/robots/pier-crawler.json";
import quayWalker from "../../db/demo/robots/quay-walker.json";
import testCrabJson from "../kinematics/fixtures/test-crab.json?raw";
import testCrabUrdf from "../kinematics/fixtures/test-crab.urdf?raw";
import { parseRobot, type Robot } from "~/kinematics";

export const DEMO_ROBOT_FILES = ["pier-crawler", "quay-walker", "hull-climber"] as const;
export type DemoRobotFile = (typeof DEMO_ROBOT_FILES)[number];

/** The demo robots by leg count, for tests that want a hexapod, a quadruped or an octopod. */
export const DEMO_ROBOTS = { six: "pier-crawler", four: "quay-walker", eight: "hull-climber" } as const satisfies Record<string, DemoRobotFile>;

const DEMO_JSON: Record<DemoRobotFile, unknown> = { "pier-crawler": pierCrawler, "quay-walker": quayWalker, "hull-climber": hullClimber };

/**
 * The demo robot's file as JSON, a fresh copy every call so a test may change it.
 * Typed as the robot it describes: the file has every field and no defaults are
 * filled in, and test/kinematics/robot.test.ts holds each file to the schema.
 */
export function demoRobotJson(file: DemoRobotFile): Robot {
  return structuredClone(DEMO_JSON[file]) as Robot;
}

/** The demo robot as the app reads it, a fresh copy every call. */
export function loadDemoRobot(file: DemoRobotFile): Robot {
  return robotOf(demoRobotJson(file), `${file}.json`);
}

/**
 * A robot definition read as the app reads it, such as a revision's `definition`
 * column (JSON, so `unknown` to Drizzle); a definition that does not parse fails
 * the test with its issues.
 */
export function robotOf(json: unknown, what = "the definition"): Robot {
  const parsed = parseRobot(json);
  if (!parsed.ok) throw new Error(`${what} does not parse: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}

/** All three demo robots, in DEMO_ROBOT_FILES order: six, four and eight legs. */
export function loadDemoRobots(): Robot[] {
  return DEMO_ROBOT_FILES.map(loadDemoRobot);
}

const FIXTURES = { "test-crab.json": testCrabJson, "test-crab.urdf": testCrabUrdf };

/** A file of test/kinematics/fixtures as text. */
export function fixtureText(name: keyof typeof FIXTURES): string {
  return FIXTURES[name];
}
