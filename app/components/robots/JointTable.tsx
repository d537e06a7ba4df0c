// Every joint's limits, calibration, speed and servo mapping: one row per leg
// and joint. Each leg's three rows are memoised together.
import { memo, useMemo } from "react";
import { legBackground } from "~/components/robot-view";
import { JOINT_NAMES } from "~/kinematics";
import { legsOf, rowFieldData, sliceSignature, useEditorData, type Slice } from "./robot-form-context";
import { CheckboxField, NumberField } from "./fields";

const th = "px-2 py-1.5 font-medium text-right";

export function JointTable() {
  const data = useEditorData();
  const list = legsOf(data);
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Joints: limits and zero offsets in servo degrees, speed, and servo mapping</caption>
        <thead className="text-xs text-ink-muted">
          <tr className="border-b border-line">
            <td colSpan={2} />
            <th colSpan={4} scope="colgroup" className="px-2 pt-1.5 text-left font-medium">
              Limits and calibration
            </th>
            <th colSpan={6} scope="colgroup" className="border-l border-line px-2 pt-1.5 text-left font-medium">
              Servo mapping
            </th>
          </tr>
          <tr className="border-b border-line">
            <th className="px-2 py-1.5 text-left font-medium">Leg</th>
            <th className="px-2 py-1.5 text-left font-medium">Joint</th>
            <th className={th}>Min °</th>
            <th className={th}>Max °</th>
            <th className={th}>Zero offset °</th>
            <th className={th}>Max speed °/s</th>
            <th className={`${th} border-l border-line`}>Channel</th>
            <th className="px-2 py-1.5 text-center font-medium">Reversed</th>
            <th className={th}>Centre µs</th>
            <th className={th}>µs/°</th>
            <th className={th}>Min µs</th>
            <th className={th}>Max µs</th>
          </tr>
        </thead>
        {list.map((leg, index) => (
          <LegJoints key={index} index={index} leg={leg} signature={sliceSignature(data, `legs[${index}].joints.`)} />
        ))}
      </table>
    </div>
  );
}

const LegJoints = memo(function LegJoints({ index, leg, signature }: { index: number; leg: { id?: unknown } | undefined; signature: string }) {
  const slice = useMemo(() => JSON.parse(signature) as Slice, [signature]);
  const id = typeof leg?.id === "string" && leg.id ? leg.id : `leg ${index + 1}`;
  const legPath = ["legs", index] as const;
  return (
    <tbody className="border-b border-line last:border-0">
      {JOINT_NAMES.map((joint, jointIndex) => {
        const at = (...relative: string[]) => {
          const path = ["joints", joint, ...relative];
          return { path: [...legPath, ...path], data: rowFieldData(slice, leg, legPath, path) };
        };
        const name = `${id} ${joint}`;
        return (
          <tr key={joint} className="align-top">
            <td className="px-2 py-1">
              {jointIndex === 0 ? (
                <span className="flex items-center gap-1.5 font-mono font-medium">
                  <span aria-hidden className={`inline-block h-3 w-3 rounded-sm ${legBackground(index)}`} />
                  {id}
                </span>
              ) : (
                <span className="sr-only">{id}</span>
              )}
            </td>
            <td className="px-2 py-1 text-ink-muted">{joint}</td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("minDeg")} label={`${name} minimum (servo degrees)`} width="w-14" />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("maxDeg")} label={`${name} maximum (servo degrees)`} width="w-14" />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("zeroOffsetDeg")} label={`${name} zero offset (degrees)`} width="w-16" />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("maxSpeedDegS")} label={`${name} maximum speed (degrees per second)`} width="w-14" />
            </td>
            <td className="border-l border-line px-2 py-1 text-right">
              <NumberField {...at("servo", "channel")} label={`${name} servo channel`} width="w-12" />
            </td>
            <td className="px-2 py-1 text-center">
              <CheckboxField {...at("servo", "reversed")} label={`${name} servo reversed`} />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("servo", "centerUs")} label={`${name} servo centre (µs)`} />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("servo", "usPerDeg")} label={`${name} servo µs per degree`} width="w-14" />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("servo", "minUs")} label={`${name} servo minimum pulse (µs)`} />
            </td>
            <td className="px-2 py-1 text-right">
              <NumberField {...at("servo", "maxUs")} label={`${name} servo maximum pulse (µs)`} />
            </td>
          </tr>
        );
      })}
    </tbody>
  );
});
