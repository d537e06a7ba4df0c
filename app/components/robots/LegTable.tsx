// The legs: where each is mounted and how long its links are, one row a leg.
// Rows are memoised: typing in one leg re-renders that leg's row only.
import { memo, useMemo } from "react";
import { legBackground } from "~/components/robot-view";
import { legsOf, rowFieldData, sliceSignature, useEditorActions, useEditorData, type LegDocument, type Slice } from "./robot-form-context";
import { NumberField, SideField, TextField } from "./fields";

const th = "px-2 py-1.5 font-medium";

export function LegTable({ onRemove }: { onRemove?: (index: number) => void }) {
  const data = useEditorData();
  const list = legsOf(data);
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Legs: mount position and yaw, link lengths</caption>
        <thead className="border-b border-line text-xs text-ink-muted">
          <tr>
            <th className={`${th} text-left`}>Leg</th>
            <th className={`${th} text-left`}>Side</th>
            <th className={`${th} text-right`}>Row</th>
            <th className={`${th} text-right`}>Mount x mm</th>
            <th className={`${th} text-right`}>y mm</th>
            <th className={`${th} text-right`}>z mm</th>
            <th className={`${th} text-right`}>Yaw °</th>
            <th className={`${th} text-right`}>Coxa mm</th>
            <th className={`${th} text-right`}>Femur mm</th>
            <th className={`${th} text-right`}>Tibia mm</th>
            {onRemove ? (
              <th className={th}>
                <span className="sr-only">Actions</span>
              </th>
            ) : null}
          </tr>
        </thead>
        <tbody>
          {list.map((leg, index) => (
            <LegRow key={index} index={index} leg={leg} signature={sliceSignature(data, `legs[${index}].`)} onRemove={onRemove} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

const LegRow = memo(function LegRow({
  index,
  leg,
  signature,
  onRemove,
}: {
  index: number;
  leg: LegDocument;
  signature: string;
  onRemove?: (index: number) => void;
}) {
  const { renameLeg } = useEditorActions();
  const slice = useMemo(() => JSON.parse(signature) as Slice, [signature]);
  const base = ["legs", index] as const;
  const at = (...relative: string[]) => ({ path: [...base, ...relative], data: rowFieldData(slice, leg, base, relative) });
  const id = typeof leg?.id === "string" && leg.id ? leg.id : `leg ${index + 1}`;
  const y = typeof leg?.mount?.y === "number" ? leg.mount.y : 0;
  return (
    <tr className="border-b border-line align-top last:border-0">
      <td className="px-2 py-1">
        <span className="flex items-start gap-1.5">
          <span aria-hidden className={`mt-1.5 inline-block h-3 w-3 shrink-0 rounded-sm ${legBackground(index)}`} />
          <span>
            <TextField {...at("id")} label={`Leg ${index + 1} id`} width="w-16 font-mono" onChange={(value) => renameLeg(index, value)} />
          </span>
        </span>
      </td>
      <td className="px-2 py-1">
        <SideField {...at("side")} label={`${id} side`} derived={y > 0 ? "left" : "right"} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("row")} label={`${id} row (0 = front; empty: by mount x)`} width="w-12" placeholder="auto" />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("mount", "x")} label={`${id} mount x (mm)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("mount", "y")} label={`${id} mount y (mm)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("mount", "z")} label={`${id} mount z (mm)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("mount", "yawDeg")} label={`${id} mount yaw (degrees)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("coxa")} label={`${id} coxa length (mm)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("femur")} label={`${id} femur length (mm)`} />
      </td>
      <td className="px-2 py-1 text-right">
        <NumberField {...at("tibia")} label={`${id} tibia length (mm)`} />
      </td>
      {onRemove ? (
        <td className="px-2 py-1 text-right">
          <button
            type="button"
            onClick={() => onRemove(index)}
            className="rounded px-2 py-0.5 text-xs text-ink-muted hover:bg-sunken hover:text-danger"
            aria-label={`Remove leg ${id}`}
          >
            Remove
          </button>
        </td>
      ) : null}
    </tr>
  );
});
