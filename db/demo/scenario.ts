// The invented demo: Breakwater Robotics Lab, which inspects harbour walls and
// ship hulls with three robots of its own design. Every name here is made up.
import type { GaitParams } from "../../app/gait/index";
import type { Role, VersionState } from "../schema";

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

/**
 * Demo gaits: each version is generated from its parameters and committed in
 * order by its author; `state` is where its review stands.
 */
export const demoGaits: {
  robot: string;
  name: string;
  description: string;
  versions: { params: GaitParams; message: string; author: string; state: VersionState; reviewer?: string }[];
}[] = [
  {
    robot: "Pier crawler",
    name: "Tripod cruise",
    description: "The everyday walk along the pier deck.",
    versions: [
      {
        params: { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40, stepHeightMm: 25 },
        message: "First tripod at a gentle pace",
        author: "theo-brandt",
        state: "released",
        reviewer: "mara-lindqvist",
      },
      {
        params: { template: "tripod", cycleMs: 1000, fps: 50, strideMm: 55, stepHeightMm: 30 },
        message: "Longer, quicker steps for the open deck",
        author: "theo-brandt",
        state: "in-review",
        reviewer: "mara-lindqvist",
      },
    ],
  },
  {
    robot: "Pier crawler",
    name: "Wave creep",
    description: "One leg at a time, for wet and weedy planks.",
    versions: [
      {
        params: { template: "wave", cycleMs: 2400, fps: 50, strideMm: 30, stepHeightMm: 20 },
        message: "Slow wave for slippery boards",
        author: "theo-brandt",
        state: "approved",
        reviewer: "mara-lindqvist",
      },
      {
        params: { template: "wave", cycleMs: 2000, fps: 50, strideMm: 36, stepHeightMm: 22 },
        message: "A little faster",
        author: "theo-brandt",
        state: "committed",
      },
    ],
  },
  {
    robot: "Pier crawler",
    name: "Ripple turn left",
    description: "Turning on the spot around a mooring post.",
    versions: [
      {
        params: { template: "ripple", cycleMs: 1600, fps: 50, strideMm: 0, turnDegPerCycle: 10, stepHeightMm: 25 },
        message: "Ten degrees a cycle",
        author: "theo-brandt",
        state: "sent-back",
        reviewer: "mara-lindqvist",
      },
      {
        params: { template: "ripple", cycleMs: 1600, fps: 50, strideMm: 0, turnDegPerCycle: 8, stepHeightMm: 28 },
        message: "Gentler turn, higher steps",
        author: "theo-brandt",
        state: "committed",
      },
    ],
  },
  {
    robot: "Quay walker",
    name: "Crawl",
    description: "Statically stable walk along the quay edge.",
    versions: [
      {
        params: { template: "wave", cycleMs: 2000, fps: 50, strideMm: 30, stepHeightMm: 25 },
        message: "Creeping crawl",
        author: "theo-brandt",
        state: "sent-back",
        reviewer: "mara-lindqvist",
      },
      {
        params: { template: "wave", cycleMs: 1800, fps: 50, strideMm: 34, stepHeightMm: 25 },
        message: "Slightly brisker crawl",
        author: "theo-brandt",
        state: "committed",
      },
    ],
  },
  {
    robot: "Quay walker",
    name: "Trot",
    description: "Diagonal pairs, for the flat concrete apron.",
    versions: [
      {
        params: { template: "trot", cycleMs: 800, fps: 50, strideMm: 40, stepHeightMm: 25 },
        message: "First trot",
        author: "theo-brandt",
        state: "released",
        reviewer: "mara-lindqvist",
      },
      {
        params: { template: "trot", cycleMs: 700, fps: 50, strideMm: 45, stepHeightMm: 28 },
        message: "Faster trot",
        author: "theo-brandt",
        state: "in-review",
        reviewer: "mara-lindqvist",
      },
    ],
  },
  {
    robot: "Hull climber",
    name: "Wave climb",
    description: "Eight legs, seven always down, for the hull plates.",
    versions: [
      {
        params: { template: "wave", cycleMs: 3200, fps: 50, strideMm: 32, stepHeightMm: 22 },
        message: "Wave for climbing",
        author: "mara-lindqvist",
        state: "released",
        reviewer: "ines-okafor",
      },
      {
        params: { template: "wave", cycleMs: 2800, fps: 50, strideMm: 36, stepHeightMm: 22 },
        message: "Shorter cycle",
        author: "mara-lindqvist",
        state: "committed",
      },
    ],
  },
  {
    robot: "Hull climber",
    name: "Alternating tetrapod",
    description: "Four legs at a time on flat decks.",
    versions: [
      {
        params: { template: "alternating-tetrapod", cycleMs: 1200, fps: 50, strideMm: 40, stepHeightMm: 25 },
        message: "Two sets of four",
        author: "mara-lindqvist",
        state: "committed",
      },
      {
        params: { template: "alternating-tetrapod", cycleMs: 1100, fps: 50, strideMm: 44, stepHeightMm: 26 },
        message: "Slightly faster",
        author: "mara-lindqvist",
        state: "committed",
      },
    ],
  },
];
