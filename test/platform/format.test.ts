import { describe, expect, test } from "vitest";
import { formatDate, formatDelta, formatNumber, formatTime, shortHash } from "~/platform/format";

// 14:05:09 UTC is 15:05 in Berlin: the text must be UTC wherever the server or browser runs.
const moment = "2025-03-04T14:05:09.250Z";

describe("times read the same on the server and in the browser (UTC, ISO 8601 order)", () => {
  test("a date, a time to the minute, and to the second", () => {
    expect(formatDate(moment)).toBe("2025-03-04");
    expect(formatTime(moment)).toBe("2025-03-04 14:05 UTC");
    expect(formatTime(new Date(moment), { seconds: true })).toBe("2025-03-04 14:05:09 UTC");
  });
  test("without the zone where a column heading already names it", () => {
    expect(formatTime(Date.parse(moment), { zone: false })).toBe("2025-03-04 14:05");
    expect(formatTime(moment, { seconds: true, zone: false })).toBe("2025-03-04 14:05:09");
  });
});

describe("numbers with their units", () => {
  test("a real minus sign, and no minus on a value that rounds to zero", () => {
    expect(formatNumber(-12.345, 1, "mm")).toBe("−12.3 mm");
    expect(formatNumber(-0.04, 1, "mm")).toBe("0.0 mm");
    expect(formatNumber(null)).toBe("—");
    expect(formatNumber(Number.NaN)).toBe("—");
  });
  test("a change carries its sign, and no change reads ±0", () => {
    expect(formatDelta(5, 1, "mm")).toBe("+5.0 mm");
    expect(formatDelta(-200, 0, "ms")).toBe("−200 ms");
    expect(formatDelta(0.01, 1)).toBe("±0");
  });
  test("a content hash is cut to twelve characters", () => {
    expect(shortHash("0123456789abcdef0123")).toBe("0123456789ab");
  });
});
