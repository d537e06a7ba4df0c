// Choosing A and B: any two versions of one robot's gaits, grouped by robot
// and gait. Versions of two robots cannot be compared (their legs and joints
// differ), so once A is picked B offers only A's robot's gaits; an A of
// another robot clears B and the hint says why. Without script the server
// refuses such a pair with the same reason beside the picker.
import { useState } from "react";
import { Form } from "react-router";
import type { VersionState } from "../../../db/schema";
import { stateWord } from "~/features/versions/state-labels";

export type PickableVersion = { id: string; number: number; message: string; state: VersionState; gaitName: string; robotName: string; robotId: string };

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
function SidePicker({
  side,
  versions,
  value,
  onChange,
}: {
  side: "A" | "B";
  versions: readonly PickableVersion[];
  value: string;
  onChange: (id: string) => void;
}) {
  const id = `compare-${side.toLowerCase()}`;
  return (
    <div className="space-y-1 text-sm">
      <label htmlFor={id} className="block font-medium">
        {side}
      </label>
      <select
        id={id}
        name={side.toLowerCase()}
        value={value}
        onChange={(event) => onChange(event.currentTarget.value)}
        required
        aria-describedby="compare-picker-hint"
        className="w-full rounded-md border border-line bg-canvas px-2 py-1.5 text-sm"
      >
        <Options versions={versions} />
      </select>
    </div>
  );
}

const versionName = (version: PickableVersion) => `${version.gaitName} v${version.number}`;

export function ComparePicker({ versions, a, b }: { versions: readonly PickableVersion[]; a: string | null; b: string | null }) {
  // A pair of two robots from the address (the server has refused it beside the picker): B starts cleared, saying why.
  const given = (id: string | null) => versions.find((version) => version.id === id) ?? null;
  const crossed = given(a) && given(b) && given(a)!.robotId !== given(b)!.robotId ? given(b) : null;
  const [pickedA, setPickedA] = useState(a ?? "");
  const [pickedB, setPickedB] = useState(crossed ? "" : (b ?? ""));
  const [cleared, setCleared] = useState<PickableVersion | null>(crossed);
  const versionA = versions.find((version) => version.id === pickedA) ?? null;
  const choicesB = versionA ? versions.filter((version) => version.robotId === versionA.robotId) : versions;

  const pickA = (id: string) => {
    setPickedA(id);
    const next = versions.find((version) => version.id === id);
    const current = versions.find((version) => version.id === pickedB);
    if (next && current && current.robotId !== next.robotId) {
      setPickedB("");
      setCleared(current);
    } else {
      setCleared(null);
    }
  };

  const scope = versionA ? `B lists the gaits of ${versionA.robotName}` : null;
  const hint = cleared
    ? `B was cleared: ${versionName(cleared)} is a gait of ${cleared.robotName}, and versions of two robots cannot be compared.${scope ? ` ${scope}.` : ""}`
    : scope
      ? `${scope}: versions of two robots cannot be compared, their legs and joints differ.`
      : "Pick A first: B then lists the gaits of A's robot.";
  return (
    <Form
      method="get"
      className="grid items-end gap-3 rounded-lg border border-line bg-surface p-3 sm:grid-cols-[1fr_1fr_auto]"
      aria-label="Choose versions to compare"
      key={`${a}-${b}`}
    >
      <SidePicker side="A" versions={versions} value={pickedA} onChange={pickA} />
      <SidePicker
        side="B"
        versions={choicesB}
        value={pickedB}
        onChange={(id) => {
          setPickedB(id);
          setCleared(null);
        }}
      />
      <button type="submit" className="rounded-md bg-accent px-4 py-1.5 text-sm font-medium text-on-accent hover:bg-accent-strong">
        Compare
      </button>
      <p id="compare-picker-hint" role="status" data-testid="picker-hint" className="text-xs text-ink-muted sm:col-span-3">
        {hint}
      </p>
    </Form>
  );
}
