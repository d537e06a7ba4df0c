// Comparing two gait versions: the sequence diff, metric deltas, joint
// overlays, playback frames, flag groups and the robot revision difference.
// Pure code only; re-exports.
export {
  DIFF_TOLERANCE,
  alignKeys,
  describeKeyChanges,
  diffSequences,
  type DiffCounts,
  type KeyChange,
  type KeyDiff,
  type KeyStatus,
  type SequenceDiff,
  type TrackDiff,
} from "./sequence-diff";
export { metricDeltas, peakJointSpeed, type MetricId, type MetricRow, type MetricSummary } from "./metrics";
export { jointOverlays, sampleAt, sampleFractions, type AngleFrames, type JointOverlay, type OverlayFlagMark } from "./joint-series";
export { frameAt, playbackOf, syncedFractions, type Playback, type PlaybackFrame, type SyncMode } from "./playback";
export { frameRanges, groupFlags, type FlagGroup } from "./flag-groups";
export { robotRevisionDiff, type RobotRevisionDiff } from "./robot-diff";
