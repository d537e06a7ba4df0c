// Where a JSON text first goes wrong, as a line and column people can find in
// their editor. JSON.parse's own messages name a position only sometimes (it
// depends on the engine's version), so this walks the grammar of RFC 8259 itself.
// Only called after JSON.parse has failed.

/** The character offset of the first syntax error, or null when the text is valid JSON. */
export function jsonErrorOffset(text: string): number | null {
  let at = 0;
  const fail = (): never => {
    throw at;
  };
  const space = () => {
    while (at < text.length && " \t\n\r".includes(text[at])) at += 1;
  };
  const literal = (word: string) => {
    for (const char of word) {
      if (text[at] !== char) fail();
      at += 1;
    }
  };
  const string = () => {
    if (text[at] !== '"') fail();
    at += 1;
    for (;;) {
      if (at >= text.length) fail();
      const char = text[at];
      if (char === '"') {
        at += 1;
        return;
      }
      if (char < " ") fail();
      if (char === "\\") {
        at += 1;
        const escape = text[at];
        if (escape === "u") {
          for (let digit = 1; digit <= 4; digit += 1) {
            if (!/[0-9a-fA-F]/.test(text[at + digit] ?? "")) {
              at += digit;
              fail();
            }
          }
          at += 5;
          continue;
        }
        if (escape === undefined || !'"\\/bfnrt'.includes(escape)) fail();
      }
      at += 1;
    }
  };
  const number = () => {
    const match = /^-?(0|[1-9][0-9]*)(\.[0-9]+)?([eE][+-]?[0-9]+)?/.exec(text.slice(at));
    if (!match || match[0] === "" || match[0] === "-") fail();
    at += match![0].length;
  };
  const value = (): void => {
    space();
    const char = text[at];
    if (char === "{") {
      at += 1;
      space();
      if (text[at] === "}") {
        at += 1;
        return;
      }
      for (;;) {
        space();
        string();
        space();
        if (text[at] !== ":") fail();
        at += 1;
        value();
        space();
        if (text[at] === ",") at += 1;
        else if (text[at] === "}") {
          at += 1;
          return;
        } else fail();
      }
    }
    if (char === "[") {
      at += 1;
      space();
      if (text[at] === "]") {
        at += 1;
        return;
      }
      for (;;) {
        value();
        space();
        if (text[at] === ",") at += 1;
        else if (text[at] === "]") {
          at += 1;
          return;
        } else fail();
      }
    }
    if (char === '"') return string();
    if (char === "t") return literal("true");
    if (char === "f") return literal("false");
    if (char === "n") return literal("null");
    return number();
  };
  try {
    value();
    space();
    if (at < text.length) fail();
    return null;
  } catch (offset) {
    if (typeof offset === "number") return offset;
    throw offset;
  }
}

/** Line and column (both from 1) of an offset. */
export function lineAndColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, offset);
  const line = before.split("\n").length;
  return { line, column: offset - before.lastIndexOf("\n") };
}

/**
 * What is wrong and where: `unexpected "o" at line 3, column 11`, the same on
 * every engine; JSON.parse's own message when the grammar walk finds nothing.
 */
export function describeJsonError(error: unknown, text: string): string {
  const offset = jsonErrorOffset(text);
  if (offset === null) return error instanceof Error ? error.message : String(error);
  const { line, column } = lineAndColumn(text, offset);
  const char = text[offset];
  const what = char === undefined ? "the text ends too early" : char === "\n" ? "unexpected line break" : `unexpected ${JSON.stringify(char)}`;
  return `${what} at line ${line}, column ${column}`;
}
