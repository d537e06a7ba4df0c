// What other features use of robots and may run in the browser.
// Services are in index.server.ts, kept apart so a component's import chain
// never reaches a server module.
export { changedFields, describeChange, type FieldChange } from "./changes";
