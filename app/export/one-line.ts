// Names and reasons are the users' own text: in a comment line of the CSV or
// the C header, control characters and the Unicode line separators would end
// the line early and let the rest read as data or code, so they become spaces.

// eslint-disable-next-line no-control-regex -- matching control characters is this pattern's purpose
export const CONTROL_CHARACTERS = /[\u0000-\u001f\u007f-\u009f\u2028\u2029]+/g;

/** Text on one line: each run of control characters or line separators is one space. */
export function oneLine(text: string): string {
  return text.replace(CONTROL_CHARACTERS, " ").trimEnd();
}
