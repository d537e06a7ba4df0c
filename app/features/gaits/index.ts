// What other features use of gaits and may run in the browser.
// Services are in index.server.ts, kept apart so a component's import chain
// never reaches a server module.
export { FLAG_LABELS } from "./flag-labels";
export { SETTING_LABELS, describeSettingChange, settingLabel, type SettingPath } from "./setting-labels";
export { jointFlags, type FlaggedFrame } from "./joint-flags";
