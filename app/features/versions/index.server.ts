// The version services other features use.
export { canonicalJson } from "./content-hash.server";
export { gaitColumns, withGait } from "./rows.server";
