// Every joint's limits, calibration, speed and servo mapping: one row per leg and joint.
import { legBackground } from "~/components/robot-view";
import { JOINT_NAMES } from "~/kinematics";
import { getAt } from "~/lib/robots/paths";
import { useEditor } from "./editor-context";
import { CheckboxField, NumberField } from "./fields";

const th = "px-2 py-1.5 font-medium text-right";

export function JointTable() {
  const state = useEditor();
  const legs = getAt(state.document, ["legs"]);
  const list = Array.isArray(legs) ? legs : [];
  return (
    <div className="overflow-x-auto rounded-lg border border-line bg-surface">
      <table className="w-full border-collapse text-sm">
        <caption className="sr-only">Joints: limits and zero offsets in servo degrees, speed, and servo mapping</caption>
        <thead className="text-xs text-ink-muted">
          <tr className="border-b border-line">
            <td colSpan={2} />
            <th colSpan={4} scope="colgroup" className="px-2 pt-1.5 text-left font-medium">Limits and calibration</th>
            <th colSpan={6} scope="colgroup" className="border-l border-line px-2 pt-1.5 text-left font-medium">Servo mapping</th>
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
        <tbody>
          {list.flatMap((leg, index) => {
            const id = typeof leg?.id === "string" && leg.id ? leg.id : `leg ${index + 1}`;
            return JOINT_NAMES.map((joint, jointIndex) => {
              const base = ["legs", index, "joints", joint] as const;
              const servo = [...base, "servo"] as const;
              const name = `${id} ${joint}`;
              return (
                <tr key={`${index}-${joint}`} className={`align-top ${jointIndex === 2 ? "border-b border-line last:border-0" : ""}`}>
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
                  <td className="px-2 py-1 text-right"><NumberField path={[...base, "minDeg"]} label={`${name} minimum (servo degrees)`} width="w-14" /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...base, "maxDeg"]} label={`${name} maximum (servo degrees)`} width="w-14" /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...base, "zeroOffsetDeg"]} label={`${name} zero offset (degrees)`} width="w-16" /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...base, "maxSpeedDegS"]} label={`${name} maximum speed (degrees per second)`} width="w-14" /></td>
                  <td className="border-l border-line px-2 py-1 text-right"><NumberField path={[...servo, "channel"]} label={`${name} servo channel`} width="w-12" /></td>
                  <td className="px-2 py-1 text-center"><CheckboxField path={[...servo, "reversed"]} label={`${name} servo reversed`} /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...servo, "centerUs"]} label={`${name} servo centre (µs)`} /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...servo, "usPerDeg"]} label={`${name} servo µs per degree`} width="w-14" /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...servo, "minUs"]} label={`${name} servo minimum pulse (µs)`} /></td>
                  <td className="px-2 py-1 text-right"><NumberField path={[...servo, "maxUs"]} label={`${name} servo maximum pulse (µs)`} /></td>
                </tr>
              );
            });
          })}
        </tbody>
      </table>
    </div>
  );
}
