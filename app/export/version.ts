// Versions written into every table, so that a released table can be told
// apart from one made by other code and reproduced byte for byte.

/** The exporter's version: bump it whenever the bytes of any table could change. */
export const EXPORTER_VERSION = "2.0.0";

/** The `format` of the JSON table (and the family name of the CSV and C layouts). */
export const TABLE_FORMAT = "gaitloom.table/2";
