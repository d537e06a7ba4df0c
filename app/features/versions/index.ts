// What other features use of versions and may run in the browser.
// Services are in index.server.ts, kept apart so a component's import chain
// never reaches a server module.
export { VERSION_STATES } from "./state-labels";
