// The version services other features use.
export { canonicalJson } from "./content-hash.server";
export { withGait } from "./rows.server";
