// The list of gait templates: adding one is one file and one line here.
import { alternatingTetrapod } from "./alternating-tetrapod";
import { custom } from "./custom";
import type { TemplateName } from "./names";
import { ripple } from "./ripple";
import type { GaitTemplate } from "./template";
import { tetrapod } from "./tetrapod";
import { tripod } from "./tripod";
import { trot } from "./trot";
import { wave } from "./wave";

export const TEMPLATES: Readonly<Record<TemplateName, GaitTemplate>> = {
  tripod,
  tetrapod,
  ripple,
  wave,
  trot,
  "alternating-tetrapod": alternatingTetrapod,
  custom,
};

export { TEMPLATE_NAMES, type TemplateName } from "./names";
export { legLayout, type GaitTemplate, type LegLayout } from "./template";
