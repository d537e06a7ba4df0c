import { describe, expect, it } from "vitest";
import { angleTable, TABLE_UNITS } from "~/export/index";
import { csvField } from "~/export/csv";
import { OVERRIDE, demoGaits, metaFor, readCsv, readJsonTable } from "./helpers";

const UNIT_WORDS = { deg: "°", rad: "rad", us: "µs" } as const;

describe('CSV export against RFC 4180 after its # comment header, read back with papaparse (reference parser, comments: "#")', () => {
  for (const gait of demoGaits()) {
    for (const units of TABLE_UNITS) {
      it(`${gait.label}, ${units}: every cell papaparse reads equals the JSON export`, () => {
        const options = { units, meta: metaFor(gait), overrideReason: gait.solved.summary.errors > 0 ? OVERRIDE : undefined };
        const csv = angleTable(gait.robot, gait.solved, { ...options, format: "csv" });
        const json = readJsonTable(angleTable(gait.robot, gait.solved, { ...options, format: "json" }));
        const [header, ...records] = readCsv(csv);
        expect(header, "header record").toEqual(["frame", "time_ms", ...json.channels.map((channel) => channel.name)]);
        expect(records.length, `records: expected ${json.frames.length} frames, got ${records.length}`).toBe(json.frames.length);
        records.forEach((record, row) => {
          const frame = json.frames[row];
          expect(record.length, `frame ${row}: fields`).toBe(json.channels.length + 2);
          expect(Number(record[0]), `frame ${row}: index`).toBe(frame.index);
          expect(Number(record[1]), `frame ${row}: expected ${frame.timeMs} ms, got ${record[1]} ms`).toBe(frame.timeMs);
          json.channels.forEach((channel, column) => {
            const cell = Number(record[column + 2]);
            const expected = frame.values[column];
            if (cell !== expected) {
              expect.fail(
                `frame ${frame.index} ${channel.name}: expected ${expected} ${UNIT_WORDS[units]} (JSON), got ${record[column + 2]} ${UNIT_WORDS[units]} (CSV)`,
              );
            }
          });
        });
      });
    }
  }

  it("RFC 4180 §2.1: every record, the last one too, ends in CRLF; no bare LF or CR", () => {
    const gait = demoGaits()[0];
    const csv = angleTable(gait.robot, gait.solved, { format: "csv", units: "deg", meta: metaFor(gait) });
    expect(csv.endsWith("\r\n"), "ends with CRLF").toBe(true);
    expect(/[^\r]\n/.test(csv), "a LF without CR before it").toBe(false);
    expect(/\r[^\n]/.test(csv), "a CR without LF after it").toBe(false);
    const lines = csv.split("\r\n").slice(0, -1);
    const comments = lines.filter((line) => line.startsWith("# "));
    expect(lines.slice(0, comments.length), "the comment header comes first").toEqual(comments);
    expect(lines.length - comments.length, "records (header + frames) after the comment header").toBe(gait.solved.frames.length + 1);
  });

  it("RFC 4180 §2.5–2.7: fields with comma, double quote, CR or LF are quoted, quotes doubled, and papaparse reads them back", () => {
    const fields = ["plain", "a,b", 'say "hi"', "two\r\nlines", "cr\ronly", "", "LF.coxa"];
    const record = fields.map(csvField).join(",");
    expect(csvField("a,b")).toBe('"a,b"');
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField("LF.coxa"), "a header name needs no quotes").toBe("LF.coxa");
    expect(readCsv(`${record}\r\n`)).toEqual([fields]);
  });
});
