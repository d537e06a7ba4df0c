// File names for downloaded robot definitions: `pier-crawler-r3.robot.json`.

export function slugOf(name: string): string {
  const slug = name
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60);
  return slug || "robot";
}

export function definitionFileName(robotName: string, revisionNumber: number): string {
  return `${slugOf(robotName)}-r${revisionNumber}.robot.json`;
}

/** The definition as a downloaded file holds it: two-space indented, ending in a newline. */
export function definitionFileText(definition: unknown): string {
  return `${JSON.stringify(definition, null, 2)}\n`;
}

export const DEFINITION_LIMIT_BYTES = 256 * 1024;
export const URDF_LIMIT_BYTES = 1024 * 1024;

export function formatBytes(bytes: number): string {
  return bytes < 1024 ? `${bytes} bytes` : `${Math.round((bytes / 1024) * 10) / 10} KB`;
}
