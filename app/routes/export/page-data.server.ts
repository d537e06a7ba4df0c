// What the export and bring-up pages show for their query: the choices, the
// table's checks and first rows, the download link and the build script's
// command. Page composition only; the tables themselves come from
// app/features/tables, the same code as the download API.
import { z } from "zod";
import { tableUnitLabel } from "~/export";
import { JOINT_NAMES, parseRobot } from "~/kinematics";
import { listProfiles } from "~/features/robots/calibration.server";
import { attempt, ServiceError } from "~/platform/errors.server";
import { id, versionOrReleased } from "~/platform/params";
import { newestRevisionInWorkspace } from "~/features/robots/robots.server";
import { makeBenchTable, prepareBenchTable } from "~/features/tables/bench-tables.server";
import { benchQuerySchema, parseQuery, tableQuerySchema, type TableQuery } from "~/features/tables/query";
import { releaseRecordOf, type ReleaseRecord } from "~/features/tables/releases.server";
import type { RenderedTable } from "~/features/tables/render.server";
import { prepareVersionTable, renderVersionTable, tableVersionsOf } from "~/features/tables/version-table.server";

/** Rows a page preview carries: the windowed list scrolls through them; the file holds every frame. */
export const PREVIEW_ROWS = 2000;

/** What the pages show of a table: the first rows as the file holds them, and its header facts. */
export function previewOf(rendered: RenderedTable, limit = PREVIEW_ROWS) {
  const { data } = rendered;
  const { meta } = data;
  const shownRows = Math.min(limit, meta.frameCount);
  return {
    preview: {
      channels: data.channels.map((channel) => ({
        column: channel.column,
        channel: channel.channel,
        name: channel.name,
        reversed: channel.reversed,
        trimDeg: channel.trimDeg,
      })),
      frameIndex: Array.from(data.frameIndex.subarray(0, shownRows)),
      timeUs: Array.from(data.timeUs.subarray(0, shownRows)),
      values: Array.from(data.values.subarray(0, shownRows * meta.channelCount)),
      decimals: meta.values.decimals,
      unitLabel: tableUnitLabel(meta.units),
      valuesDescription: meta.values.description,
      frameCount: meta.frameCount,
      shownRows,
    },
    facts: {
      robot: meta.robot,
      gait: { name: meta.gait.name, version: meta.gait.version, contentHash: meta.gait.contentHash },
      rateHz: meta.rateHz,
      framePeriodMs: meta.framePeriodMs,
      frameCount: meta.frameCount,
      channelCount: meta.channelCount,
      units: meta.units,
      calibrationProfile: meta.calibrationProfile,
      overrideReason: meta.overrideReason,
      flags: meta.flags,
      clampedCount: meta.clamped.length,
      exporterVersion: meta.exporterVersion,
      solverVersion: meta.solverVersion,
      fileName: rendered.fileName,
      bytes: Buffer.byteLength(rendered.body, "utf8"),
      sha256: rendered.sha256,
    },
  };
}

export type PageProblem = { message: string; parameter: string | null; needsOverride: boolean; issues: { path: string; message: string }[] };

/** A refusal as the page shows it, beside the form: the sentence, the field at fault, the issues. */
function problemOf(refusal: ServiceError): PageProblem {
  const details = refusal.record;
  const needsOverride = refusal.code === "override-required";
  return {
    // The API's sentence names its query parameter; the page names its field.
    message: needsOverride
      ? `${String(details.summary)}. To export it anyway, give an override reason; it is written into the table's header and the audit log.`
      : refusal.message,
    parameter: typeof details.parameter === "string" ? details.parameter : (refusal.field ?? null),
    needsOverride,
    issues: details.issues ? [...details.issues] : [],
  };
}

/** A page's GET form: empty fields are left out, fields of other forms are ignored. */
function formQuery(search: URLSearchParams, keys: readonly string[]): URLSearchParams {
  const kept = new URLSearchParams();
  for (const key of keys) {
    const value = search.get(key);
    if (value !== null && value.trim() !== "") kept.set(key, value);
  }
  return kept;
}

/** A query string of the given parameters, in this order, leaving out those not given. */
function apiQueryString(query: Record<string, string | number | undefined>): string {
  const search = new URLSearchParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== "") search.set(key, String(value));
  return search.toString();
}

/** `curl` for a build script: the token from the environment, the URL single-quoted (the query is percent-encoded). */
export function curlCommand(url: string, fileName: string): string {
  return `curl -fsS -H "Authorization: Bearer $GAITLOOM_TOKEN" -o '${fileName}' '${url}'`;
}

const EXPORT_FORM_KEYS = ["gait", "version", "format", "units", "rate", "profile", "override"] as const;

const exportPageSchema = tableQuerySchema.extend({
  gait: id("gait must be a gait id").optional(),
  version: versionOrReleased('version must be a number or "released"').optional(),
});

type GaitChoice = { id: string; name: string; robotId: string; robotName: string; releasedVersion: number | null; latestVersion: number | null };

/** Everything the export page shows for its query: the choices, the table's preview, the download and the command. */
export async function exportPageData(workspaceId: string, search: URLSearchParams, publicUrl: string, gaitChoices: GaitChoice[]) {
  const gaitsWithVersions = gaitChoices.filter((gait) => gait.latestVersion !== null);
  let problem: PageProblem | null = null;
  const parsed = await attempt(() => parseQuery(exportPageSchema, formQuery(search, EXPORT_FORM_KEYS)));
  if (!parsed.ok) problem = problemOf(parsed.refusal);
  const query: z.output<typeof exportPageSchema> = parsed.ok ? parsed.value : { format: "csv", units: "deg" };
  const gait =
    gaitsWithVersions.find((entry) => entry.id === query.gait) ?? gaitsWithVersions.find((entry) => entry.releasedVersion !== null) ?? gaitsWithVersions[0];
  const base = {
    gaits: gaitsWithVersions,
    problem,
    query: { format: query.format, units: query.units, rate: query.rate ?? null, profile: query.profile ?? null, override: query.override ?? null },
  };
  if (!gait) return { ...base, gait: null, version: null, versions: [], profiles: [], sequence: null, table: null, download: null, release: null };

  const version: number | "released" =
    query.gait === gait.id && query.version !== undefined ? query.version : gait.releasedVersion !== null ? "released" : gait.latestVersion!;
  const [versions, profiles] = await Promise.all([tableVersionsOf(workspaceId, gait.id), listProfiles(gait.robotId)]);
  const profile = query.gait === gait.id ? query.profile : undefined;
  const tableQuery: TableQuery = { format: query.format, units: query.units, rate: query.rate, profile, override: query.override };
  const apiPath = `/api/v1/gaits/${gait.id}/versions/${version}/table?${apiQueryString({ format: query.format, units: query.units, rate: query.rate, profile, override: query.override })}`;

  // Filled in as far as the table gets: a refusal to print it still shows the sequence and the release record.
  let table = null as ReturnType<typeof previewOf> | null;
  let sequence = null as { fps: number; cycleMs: number; loop: boolean } | null;
  let release = null as (ReleaseRecord & { matches: boolean | null; path: string }) | null;
  let download = null as { path: string; fileName: string; command: string } | null;
  const made = await attempt(async () => {
    const prepared = await prepareVersionTable(workspaceId, gait.id, version, tableQuery);
    sequence = { fps: prepared.sequence.fps, cycleMs: prepared.sequence.cycleMs, loop: prepared.sequence.loop };
    const record = await releaseRecordOf(prepared.version.id);
    if (record) release = { ...record, matches: null, path: `/api/v1/gaits/${gait.id}/versions/${prepared.version.number}/table?${record.tableFormat}` };
    const rendered = await renderVersionTable(prepared);
    table = previewOf(rendered);
    // The page's table is the release's canonical one when its query is the recorded one: then the hashes must agree.
    if (
      release &&
      apiQueryString({
        format: prepared.format,
        units: prepared.units,
        rate: query.rate === prepared.sequence.fps ? undefined : query.rate,
        profile,
        override: query.override,
      }) === record!.tableFormat
    ) {
      release.matches = release.tableSha256 === rendered.sha256;
    }
    download = { path: apiPath, fileName: rendered.fileName, command: curlCommand(`${publicUrl}${apiPath}`, rendered.fileName) };
  });
  if (!made.ok) problem = problemOf(made.refusal);
  return {
    ...base,
    problem,
    gait,
    version,
    versions,
    profiles: profiles.map((entry) => ({ name: entry.name, revision: entry.revision })),
    sequence,
    table,
    download,
    release,
  };
}

const BENCH_FORM_KEYS = ["robot", "kind", "leg", "joint", "speed", "dwell", "seconds", "fps", "hold", "format", "units", "profile", "override"] as const;

const benchPageSchema = benchQuerySchema.extend({ robot: id("robot must be a robot id").optional() });

type RobotChoice = { id: string; name: string };

/** Everything the bring-up page shows: the robot's joints, the bench table's checks and preview, the download. */
export async function benchPageData(workspaceId: string, search: URLSearchParams, publicUrl: string, robotChoices: RobotChoice[]) {
  let problem: PageProblem | null = null;
  const parsed = await attempt(() => parseQuery(benchPageSchema, formQuery(search, BENCH_FORM_KEYS)));
  if (!parsed.ok) problem = problemOf(parsed.refusal);
  const query = parsed.ok ? parsed.value : parseQuery(benchPageSchema, new URLSearchParams());
  const robotChoice = robotChoices.find((entry) => entry.id === query.robot) ?? robotChoices[0];
  const { robot: _robot, ...benchQuery } = query;
  const base = {
    robots: robotChoices,
    problem,
    query: {
      ...benchQuery,
      leg: benchQuery.leg ?? null,
      joint: benchQuery.joint ?? null,
      profile: benchQuery.profile ?? null,
      override: benchQuery.override ?? null,
    },
  };
  if (!robotChoice) return { ...base, robot: null, legs: [], profiles: [], table: null, checks: null, download: null };

  const [row, profiles] = await Promise.all([newestRevisionInWorkspace(workspaceId, robotChoice.id), listProfiles(robotChoice.id)]);
  if (!row) throw new ServiceError(404, "not-found", `No robot ${robotChoice.id} in this workspace.`);
  const parsedRobot = parseRobot(row.definition);
  const legs = parsedRobot.ok
    ? parsedRobot.robot.legs.map((leg) => ({
        id: leg.id,
        joints: JOINT_NAMES.map((joint) => ({
          joint,
          minDeg: leg.joints[joint].minDeg,
          maxDeg: leg.joints[joint].maxDeg,
          maxSpeedDegS: leg.joints[joint].maxSpeedDegS,
          channel: leg.joints[joint].servo.channel,
        })),
      }))
    : [];
  // A sweep starts from the first leg's coxa, so the page has a table to show at once.
  if (query.kind === "sweep") {
    query.leg ??= legs[0]?.id;
    query.joint ??= "coxa";
    benchQuery.leg = query.leg;
    benchQuery.joint = query.joint;
    base.query = { ...base.query, leg: query.leg ?? null, joint: query.joint };
  }
  const apiPath = `/api/v1/robots/${robotChoice.id}/bench-table?${apiQueryString(
    query.kind === "centre"
      ? { kind: "centre", seconds: query.seconds, fps: query.fps, format: query.format, units: query.units, profile: query.profile, override: query.override }
      : {
          kind: "sweep",
          leg: query.leg,
          joint: query.joint,
          speed: query.speed,
          dwell: query.dwell,
          fps: query.fps,
          hold: query.hold,
          format: query.format,
          units: query.units,
          profile: query.profile,
          override: query.override,
        },
  )}`;
  let table = null as ReturnType<typeof previewOf> | null;
  let checks = null as {
    flags: { frame: number; kind: string; severity: string; message: string }[];
    totalFlags: number;
    peakSpeedDegS: number | null;
    limitDegS: number | null;
    durationS: number;
  } | null;
  let download = null as { path: string; fileName: string; command: string } | null;
  if (query.kind === "sweep" && (!query.leg || !query.joint)) {
    problem ??= { message: "Choose the leg and the joint to sweep.", parameter: query.leg ? "joint" : "leg", needsOverride: false, issues: [] };
  } else {
    const made = await attempt(async () => {
      const prepared = await prepareBenchTable(workspaceId, robotChoice.id, benchQuery);
      // The checks are shown even when the table needs an override to be made.
      const { checks: bench, table: printed } = await makeBenchTable(prepared);
      if (printed instanceof ServiceError) problem = problemOf(printed);
      const rendered = printed instanceof ServiceError ? null : printed;
      const joint = query.kind === "sweep" ? prepared.robot.legs.find((leg) => leg.id === query.leg)!.joints[query.joint!] : null;
      checks = {
        flags: bench.flags.slice(0, 50).map((flag) => ({ frame: flag.frame, kind: flag.kind, severity: flag.severity, message: flag.message })),
        totalFlags: bench.flags.length,
        peakSpeedDegS: query.kind === "sweep" ? (bench.summary.peakSpeedDegS[query.leg!]?.[query.joint!] ?? null) : null,
        limitDegS: joint?.maxSpeedDegS ?? null,
        durationS: bench.frameCount / query.fps,
      };
      if (rendered) {
        table = previewOf(rendered);
        download = { path: apiPath, fileName: rendered.fileName, command: curlCommand(`${publicUrl}${apiPath}`, rendered.fileName) };
      }
    });
    if (!made.ok) problem = problemOf(made.refusal);
  }
  return {
    ...base,
    problem,
    robot: { id: row.id, name: row.name, revision: row.revision },
    legs,
    profiles: profiles.map((entry) => ({ name: entry.name, revision: entry.revision })),
    table,
    checks,
    download,
  };
}
