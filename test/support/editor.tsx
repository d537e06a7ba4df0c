// The gait editor under test: the demo crawler, a tripod on it, and a render
// with an editor store of its own (the component tests add jsdom themselves).
import { render } from "@testing-library/react";
import type { ReactNode } from "react";
import { generateGait, type GaitParams, type Sequence } from "~/gait";
import type { Robot } from "~/kinematics";
import { EditorStoreProvider } from "~/stores/editor-context";
import { createEditorStore, type EditorStore } from "~/stores/editor-store";
import { loadDemoRobot } from "./robots";

export const crawler: Robot = loadDemoRobot("pier-crawler");

export const tripod = (params: Partial<GaitParams> = {}): Sequence =>
  generateGait(crawler, { template: "tripod", cycleMs: 1200, fps: 50, strideMm: 40, ...params } as GaitParams);

export function renderWithStore(ui: ReactNode, options: { sequence?: Sequence; readOnly?: boolean } = {}): { store: EditorStore } & ReturnType<typeof render> {
  const store = createEditorStore({ robot: crawler, sequence: options.sequence ?? tripod(), revision: 1, readOnly: options.readOnly ?? false });
  const view = render(<EditorStoreProvider store={store}>{ui}</EditorStoreProvider>);
  return { store, ...view };
}
