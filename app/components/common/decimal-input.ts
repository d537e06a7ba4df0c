// How every field that takes a decimal number is typed into: a text input with
// the decimal keypad on touch screens, so that the field shows what was typed
// ("1.", "abc") until it is checked, never the browser's own number handling.
export const decimalInput = { type: "text", inputMode: "decimal", autoComplete: "off", spellCheck: false } as const;
