// The optional rest pose: servo angles of the robot lying on its belly, powered down.
import { legBackground } from "~/components/robot-view";
import { getAt } from "~/features/robots/paths";
import { fieldData, isLocked, legsOf, useEditorActions, useEditorData } from "./robot-form-context";
import { NumberField } from "./fields";

export function RestPoseSection({ onToggle }: { onToggle: (on: boolean) => void }) {
  const data = useEditorData();
  const { mode } = useEditorActions();
  const rest = getAt(data.document, ["rest"]);
  const ids = legsOf(data).map((leg, index) => ({ id: typeof leg?.id === "string" ? leg.id : "", index }));
  const on = rest !== undefined;
  const locked = isLocked(mode, ["rest"]);
  return (
    <div className="space-y-3">
      <label className="flex items-center gap-2 text-sm">
        <input
          type="checkbox"
          checked={on}
          aria-readonly={locked || undefined}
          onChange={(event) => {
            if (!locked) onToggle(event.currentTarget.checked);
          }}
          className="h-4 w-4 accent-accent"
        />
        This robot has a rest pose (servo degrees; entry and exit moves start and end there)
      </label>
      {on ? (
        <div className="overflow-x-auto rounded-lg border border-line bg-surface">
          <table className="border-collapse text-sm">
            <caption className="sr-only">Rest pose: servo degrees per leg and joint</caption>
            <thead className="border-b border-line text-xs text-ink-muted">
              <tr>
                <th className="px-2 py-1.5 text-left font-medium">Leg</th>
                <th className="px-2 py-1.5 text-right font-medium">Coxa °</th>
                <th className="px-2 py-1.5 text-right font-medium">Femur °</th>
                <th className="px-2 py-1.5 text-right font-medium">Tibia °</th>
              </tr>
            </thead>
            <tbody>
              {ids.map(({ id, index }) => (
                <tr key={index} className="border-b border-line align-top last:border-0">
                  <td className="px-2 py-1">
                    <span className="flex items-center gap-1.5 font-mono font-medium">
                      <span aria-hidden className={`inline-block h-3 w-3 rounded-sm ${legBackground(index)}`} />
                      {id || `leg ${index + 1}`}
                    </span>
                  </td>
                  {(["coxa", "femur", "tibia"] as const).map((joint) => (
                    <td key={joint} className="px-2 py-1 text-right">
                      <NumberField path={["rest", id, joint]} data={fieldData(data, ["rest", id, joint])} label={`${id} rest ${joint} (servo degrees)`} />
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
