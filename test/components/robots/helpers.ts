// Demo robots for the robot editor and view tests, parsed as the app would.
import hullClimber from "../../../db/demo/robots/hull-climber.json";
import pierCrawler from "../../../db/demo/robots/pier-crawler.json";
import quayWalker from "../../../db/demo/robots/quay-walker.json";
import { parseRobot, type Robot } from "~/kinematics";

const FILES = { "pier-crawler.json": pierCrawler, "quay-walker.json": quayWalker, "hull-climber.json": hullClimber };

/** A fresh copy every call, so tests may change it. */
export function demoRobot(file: keyof typeof FILES): Robot {
  const parsed = parseRobot(structuredClone(FILES[file]));
  if (!parsed.ok) throw new Error(`${file}: ${parsed.issues.map((issue) => `${issue.path}: ${issue.message}`).join("; ")}`);
  return parsed.robot;
}
