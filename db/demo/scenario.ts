// The invented demo: Breakwater Robotics Lab, which inspects harbour walls and
// ship hulls with three robots of its own design. Every name here is made up.
import type { Role } from "../schema";

export const demoWorkspace = { slug: "breakwater-lab", name: "Breakwater Robotics Lab" };

export const demoPeople: { login: string; name: string; email: string; role: Role; githubId: number }[] = [
  { login: "ines-okafor", name: "Ines Okafor", email: "ines@breakwater-lab.test", role: "owner", githubId: 910001 },
  { login: "mara-lindqvist", name: "Mara Lindqvist", email: "mara@breakwater-lab.test", role: "lead", githubId: 910002 },
  { login: "theo-brandt", name: "Theo Brandt", email: "theo@breakwater-lab.test", role: "animator", githubId: 910003 },
  { login: "priya-sandoval", name: "Priya Sandoval", email: "priya@breakwater-lab.test", role: "firmware", githubId: 910004 },
  { login: "kenji-wu", name: "Kenji Wu", email: "kenji@breakwater-lab.test", role: "viewer", githubId: 910005 },
];

/** Robot definitions live as JSON beside this file: db/demo/robots/<file>. */
export const demoRobots = [
  { file: "pier-crawler.json", author: "theo-brandt", message: "First measured build of the six-legged pier crawler" },
  { file: "quay-walker.json", author: "theo-brandt", message: "Four-legged quay walker, links from the CAD model" },
  { file: "hull-climber.json", author: "mara-lindqvist", message: "Eight-legged hull climber prototype" },
];
