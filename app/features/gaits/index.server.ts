// The gait services other features use.
export { draftSaveBody } from "./drafts.server";
