// The ids and numbers that route parameters, forms and query strings carry,
// read with zod the same way by every route. Each takes the sentence to show
// when the value is bad; without one, zod's own.
import { z } from "zod";

type ErrorText = string | ((issue: { input?: unknown }) => string);

const withError = (error?: ErrorText) => (error === undefined ? undefined : { error });

/** Any 8-4-4-4-12 hex id, which is what a uuid column holds (not only RFC 9562 versions). */
export const id = (error?: ErrorText) => z.guid(withError(error));

/** An id in a path or query parameter of the JSON API, named in its refusal. */
export const idParam = (name: string) => id((issue) => `${name} must be a UUID (got ${JSON.stringify(issue.input)})`);

export const isId = (value: string) => id().safeParse(value).success;

// Counted from 1, nine digits at most: every such number fits PostgreSQL's
// integer (up to 2 147 483 647), so a longer one is a bad parameter rather
// than a failed query; no sign, no leading zero, no spaces.
const FROM_ONE = "[1-9][0-9]{0,8}";

/** The same rule for documents that describe a parameter (OpenAPI `pattern`). */
export const NUMBER_PATTERN = `^${FROM_ONE}$`;

const fromOne = (error?: ErrorText) => z.string().regex(new RegExp(NUMBER_PATTERN), withError(error)).transform(Number);

/** A robot revision or a calibration profile revision, as text: 1, 2, … */
export const revisionNumber = fromOne;

/** A gait version's number, as text: 1, 2, … */
export const versionNumber = fromOne;

/** A version number, or `released` for the gait's released version. */
export const versionOrReleased = (error?: ErrorText) => z.union([z.literal("released"), versionNumber()], withError(error));

// A number as a browser's number field sends it: HTML's "valid floating-point
// number" (an optional minus, digits with an optional fraction or a fraction
// alone, an optional exponent). Not what Number() or z.coerce also read:
// 0x10, 0b110010, 0o20, " 16 ", "+16", "Infinity" or "" (which is 0).
const DECIMAL = /^-?(?:\d+(?:\.\d+)?|\.\d+)(?:[eE][+-]?\d+)?$/;

export const isDecimal = (text: string) => DECIMAL.test(text);

/** Text written in decimal as its number, other text as NaN (which a number schema refuses); anything else as it is. */
export const fromDecimalText = (value: unknown) => (typeof value === "string" ? (isDecimal(value) ? Number(value) : Number.NaN) : value);

/**
 * A number schema for a query parameter or form field, read from decimal text
 * only: `schema`'s error is the refusal of anything else. (Its JSON Schema is
 * `schema`'s own, so OpenAPI still says number.)
 */
export const decimal = <Schema extends z.ZodType<number>>(schema: Schema) => z.preprocess(fromDecimalText, schema);

/** A gait's draft revision, as text: 0 before the first save, then as any revision. */
export const draftRevision = (error?: ErrorText) =>
  z
    .string()
    .regex(new RegExp(`^(?:0|${FROM_ONE})$`), withError(error))
    .transform(Number);
