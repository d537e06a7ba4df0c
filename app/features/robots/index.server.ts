// The robot services other features use.
export { findProfileByName, type StoredProfile } from "./calibration.server";
export { robotOfRevision } from "./revision-robot.server";
export { newestRevisionInWorkspace } from "./robots.server";
