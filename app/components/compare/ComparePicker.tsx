// Choosing A and B: any two versions of one robot's gaits, grouped by robot and gait.
import { Form } from "react-router";
import type { VersionState } from "../../../db/schema";
import { stateWord } from "~/features/versions/state-labels";

export type PickableVersion = { id: string; number: number; message: string; state: VersionState; gaitName: string; robotName: string };

function Options({ versions }: { versions: readonly PickableVersion[] }) {
  const groups = new Map<string, PickableVersion[]>();
  for (const version of versions) {
    const key = `${version.robotName} › ${version.gaitName}`;
    groups.set(key, [...(groups.get(key) ?? []), version]);
  }
  return (
    <>
      <option value="" disabled>
        Choose a version
      </option>
      {[...groups.entries()].map(([label, members]) => (
        <optgroup key={label} label={label}>
          {members.map((version) => (
            <option key={version.id} value={version.id}>
              {version.gaitName} v{version.number} ({stateWord(version.state)}) — {version.message}
            </option>
          ))}
        </optgroup>
      ))}
    </>
  );
}

/** The version picked as side A or B. */
function SidePicker({ side, versions, value }: { side: "A" | "B"; versions: readonly PickableVersion[]; value: string | null }) {
  return (
    <label className="space-y-1 text-sm">
      <span className="font-medium">{side}</span>
      <select name={side.toLowerCase()} defaultValue={value ?? ""} required className="w-full rounded-md border border-line bg-canvas px-2 py-1.5 text-sm">
        <Options versions={versions} />
      </select>
    </label>
  );
}

export function ComparePicker({ versions, a, b }: { versions: readonly PickableVersion[]; a: string | null; b: string | null }) {
  return (
    <Form
      method="get"
      className="grid items-end gap-3 rounded-lg border border-line bg-surface p-3 sm:grid-cols-[1fr_1fr_auto]"
      aria-label="Choose versions to compare"
      key={`${a}-${b}`}
    >
      <SidePicker side="A" versions={versions} value={a} />
      <SidePicker side="B" versions={versions} value={b} />
      <button type="submit" className="rounded-md bg-accent px-4 py-1.5 text-sm font-medium text-on-accent hover:bg-accent-strong">
        Compare
      </button>
    </Form>
  );
}
