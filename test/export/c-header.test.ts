import { beforeAll, describe, expect, it } from "vitest";
import { angleTable, TABLE_UNITS, type TableUnits } from "~/export/index";
import { roundHalfAwayFromZero, UNIT_ROUNDING } from "~/export/rounding";
import type { JointName } from "~/kinematics/index";
import { OVERRIDE, cNames, compileAndRun, demoGaits, metaFor, printingProgram, readJsonTable, readPrinted, requireGcc, type DemoGait } from "./helpers";

beforeAll(() => {
  requireGcc();
});

function tables(gait: DemoGait, units: TableUnits, extra: { gaitName?: string; overrideReason?: string } = {}) {
  const options = {
    units,
    meta: metaFor(gait, extra.gaitName ? { gaitName: extra.gaitName } : {}),
    overrideReason: extra.overrideReason ?? (gait.solved.summary.errors > 0 ? OVERRIDE : undefined),
  };
  return {
    c: angleTable(gait.robot, gait.solved, { ...options, format: "c" }),
    json: readJsonTable(angleTable(gait.robot, gait.solved, { ...options, format: "json" })),
    gaitName: options.meta.gaitName,
  };
}

describe("C header compiled with gcc -std=c99 -Wall -Wextra -Werror -pedantic (reference toolchain)", () => {
  for (const gait of demoGaits()) {
    for (const units of TABLE_UNITS) {
      it(`${gait.label}, ${units}: the program's printed table equals the JSON export at the same rounding`, () => {
        const { c, json, gaitName } = tables(gait, units);
        const printed = readPrinted(compileAndRun({ "table.h": c, "main.c": printingProgram("table.h", gaitName, units) }));
        const { scale } = UNIT_ROUNDING[units];
        expect(printed.frames, "FRAMES").toBe(json.frames.length);
        expect(printed.channels, "CHANNELS").toBe(json.channels.length);
        expect(printed.periodUs, `FRAME_PERIOD_US: expected ${json.meta.framePeriodMs * 1000} µs`).toBe(Math.round(json.meta.framePeriodMs * 1000));
        expect(printed.channelMap, "channel map").toEqual(json.channels.map((channel) => channel.channel));
        json.frames.forEach((frame, row) => {
          frame.values.forEach((value, column) => {
            const scaled = value * scale;
            // The JSON holds the fixed-point number exactly: value × scale is a whole number.
            expect(Math.abs(scaled - Math.round(scaled)), `frame ${frame.index} column ${column}: ${value} × ${scale} is not whole`).toBeLessThan(1e-6);
            if (printed.rows[row][column] !== Math.round(scaled)) {
              expect.fail(
                `frame ${frame.index} ${json.channels[column].name}: expected ${Math.round(scaled)} (JSON ${value} × ${scale}), got ${printed.rows[row][column]} from the C table`,
              );
            }
          });
        });
      });
    }
  }

  it("names the robot, revision, gait version, content hash, override reason and the safety cautions in its comment block", () => {
    const gait = demoGaits()[3];
    const { c } = tables(gait, "deg", { overrideReason: OVERRIDE });
    const comment = c.slice(0, c.indexOf("*/"));
    expect(comment).toContain(`Robot:        ${gait.robot.name}, revision 3`);
    expect(comment).toContain("Gait:         Long wave, version 2");
    expect(comment).toContain("Content hash: sha256:5d41402abc4b2a76b9719d911017c592");
    expect(comment).toContain(`Override:     ${OVERRIDE}`);
    expect(comment).toContain("robot on a stand");
    expect(comment).toContain("current-limited supply");
    expect(c).toMatch(/#ifndef GAITLOOM_LONG_WAVE_DEG10_H\n#define GAITLOOM_LONG_WAVE_DEG10_H/);
    expect(c).toContain("#include <stdint.h>");
    expect(c).toContain("static const int16_t gaitloom_long_wave_deg10[GAITLOOM_LONG_WAVE_DEG10_FRAMES][GAITLOOM_LONG_WAVE_DEG10_CHANNELS]");
  });

  it("compiles cleanly with hostile names and reasons: comment terminators, nested comment openers, trigraphs, line breaks, UTF-8", () => {
    const gait = demoGaits()[0];
    // A reason ending in "??/" would be a trigraph splicing the comment's line (gcc -Wtrigraphs).
    const hostile = "Walk */ int x = 1; /* ??/\nnext ??= line\r\n — Übergang \u2028 end ??/";
    const { c, json, gaitName } = tables(gait, "us", { gaitName: hostile, overrideReason: hostile });
    expect(cNames(gaitName, "us").array).toBe("gaitloom_walk_int_x_1_next_line_ubergang_end_us");
    const printed = readPrinted(compileAndRun({ "table.h": c, "main.c": printingProgram("table.h", gaitName, "us") }));
    expect(printed.rows[0]).toEqual(json.frames[0].values);
    expect(json.meta.overrideReason, "the JSON keeps the reason verbatim").toBe(hostile.trim());
  });

  it("a program using only the table, and one including the degree and pulse headers of one gait together, compile without warnings", () => {
    const gait = demoGaits()[0];
    const deg = tables(gait, "deg");
    const us = tables(gait, "us");
    const onlyTable = `#include <stdio.h>
#include "deg.h"
int main(void) { printf("%d\\n", (int)gaitloom_tripod_walk_deg10[0][0]); return 0; }
`;
    expect(Number(compileAndRun({ "deg.h": deg.c, "main.c": onlyTable }).trim())).toBe(Math.round(deg.json.frames[0].values[0] * 10));
    const both = `#include <stdio.h>
#include "deg.h"
#include "us.h"
#include "deg.h"
int main(void) {
  printf("%d %u\\n", (int)gaitloom_tripod_walk_deg10[1][2], (unsigned)gaitloom_tripod_walk_us[1][2]);
  return GAITLOOM_TRIPOD_WALK_DEG10_FRAMES == GAITLOOM_TRIPOD_WALK_US_FRAMES ? 0 : 1;
}
`;
    const [degCell, usCell] = compileAndRun({ "deg.h": deg.c, "us.h": us.c, "main.c": both }).trim().split(" ").map(Number);
    expect(degCell).toBe(Math.round(deg.json.frames[1].values[2] * 10));
    expect(usCell).toBe(us.json.frames[1].values[2]);
  });
});

describe("rounding against ISO C99 round() (7.12.9.6: halfway cases away from zero), computed by gcc", () => {
  it("roundHalfAwayFromZero equals C's round() on halves, near-halves and negatives, and never gives −0", () => {
    const xs = [
      0.5, -0.5, 1.5, -1.5, 2.5, -2.5, 12.5, -12.5, -0.4, 0.4, 0.49999999999999994, -0.49999999999999994, 4503599627370495.5, -13.000000000000002, 1e-300,
      -1e-300,
    ];
    const program = `#include <math.h>
#include <stdio.h>
int main(void) {
  static const double xs[] = { ${xs.map((x) => x.toPrecision(17)).join(", ")} };
  unsigned i;
  for (i = 0; i < sizeof xs / sizeof xs[0]; i += 1) printf("%.1f\\n", round(xs[i]));
  return 0;
}
`;
    const fromC = compileAndRun({ "main.c": program }, ["-lm"]).trim().split("\n").map(Number);
    xs.forEach((x, i) => {
      const ours = roundHalfAwayFromZero(x);
      expect(ours, `round(${x}): expected ${fromC[i]} (C), got ${ours}`).toBe(fromC[i] === 0 ? 0 : fromC[i]);
      expect(Object.is(ours, -0), `round(${x}) is −0`).toBe(false);
    });
  });

  it("every degree and radian cell of a demo walk is C's round(servoDeg × 10) and round(servoDeg × π/180 × 10000) of the solved angle", () => {
    const gait = demoGaits()[3];
    const angles: number[] = [];
    const { json: degJson } = tables(gait, "deg");
    const order = degJson.channels.map((channel) => [channel.leg, channel.joint as JointName] as const);
    for (const frame of gait.solved.frames) for (const [leg, joint] of order) angles.push(frame.legs[leg].angles[joint]);
    const program = `#include <math.h>
#include <stdio.h>
static const double angles[] = { ${angles.map((x) => x.toPrecision(17)).join(", ")} };
int main(void) {
  unsigned i;
  const double radPerDeg = 3.14159265358979323846 / 180.0;
  for (i = 0; i < sizeof angles / sizeof angles[0]; i += 1) printf("%.0f %.0f\\n", round(angles[i] * 10.0), round(angles[i] * radPerDeg * 10000.0));
  return 0;
}
`;
    const fromC = compileAndRun({ "main.c": program }, ["-lm"])
      .trim()
      .split("\n")
      .map((line) => line.split(" ").map(Number));
    const { json: radJson } = tables(gait, "rad");
    const columns = order.length;
    degJson.frames.forEach((frame, row) => {
      frame.values.forEach((value, column) => {
        const [deg10, rad10000] = fromC[row * columns + column];
        const degCell = Math.round(value * 10);
        const radCell = Math.round(radJson.frames[row].values[column] * 10000);
        if (degCell !== deg10 + 0 || radCell !== rad10000 + 0) {
          expect.fail(
            `frame ${frame.index} ${degJson.channels[column].name}: expected ${deg10} tenths of a degree and ${rad10000} ten-thousandths of a radian (C), got ${degCell} and ${radCell}`,
          );
        }
      });
    });
  });
});
