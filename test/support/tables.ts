// Angle tables read back: the JSON table (format "gaitloom.table/2") as the
// exporter's unit tests and the table API's tests parse it.
import type { AngleTableData } from "~/export";

/** A JSON angle table parsed: meta and channels as the exporter wrote them, one value a channel in each frame. */
export type JsonTable = {
  format: string;
  meta: AngleTableData["meta"];
  channels: AngleTableData["channels"];
  frames: { index: number; timeMs: number; values: number[] }[];
};

export function readJsonTable(text: string): JsonTable {
  return JSON.parse(text) as JsonTable;
}
