// The robot as a whole: name, description, mass and centre of mass, standing height.
import { fieldData, useEditorData } from "./robot-form-context";
import { NumberField, TextField } from "./fields";

function Labelled({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="flex flex-col gap-1 text-sm">
      <span className="text-xs text-ink-muted" aria-hidden>
        {label}
      </span>
      <span>{children}</span>
    </div>
  );
}

export function BodySection() {
  const data = useEditorData();
  const at = (...path: (string | number)[]) => ({ path, data: fieldData(data, path) });
  return (
    <div className="grid gap-4 rounded-lg border border-line bg-surface p-4 md:grid-cols-[minmax(12rem,1fr)_auto]">
      <div className="space-y-3">
        <Labelled label="Name">
          <TextField {...at("name")} label="Robot name" />
        </Labelled>
        <Labelled label="Description">
          <TextField {...at("description")} label="Description" multiline />
        </Labelled>
      </div>
      <div className="grid grid-cols-3 content-start gap-x-3 gap-y-3">
        <Labelled label="Mass kg">
          <NumberField {...at("body", "massKg")} label="Body mass (kg)" />
        </Labelled>
        <Labelled label="Stand height mm">
          <NumberField {...at("standHeight")} label="Stand height (mm)" />
        </Labelled>
        <span />
        <Labelled label="CoM x mm">
          <NumberField {...at("body", "com", 0)} label="Centre of mass x (mm)" />
        </Labelled>
        <Labelled label="CoM y mm">
          <NumberField {...at("body", "com", 1)} label="Centre of mass y (mm)" />
        </Labelled>
        <Labelled label="CoM z mm">
          <NumberField {...at("body", "com", 2)} label="Centre of mass z (mm)" />
        </Labelled>
      </div>
    </div>
  );
}
