// The list of checks; flags of one frame come in this order. Adding one is one file
// and one line here.
import type { Check } from "./check";
import { comOutsideCheck } from "./com-outside";
import { footSlipCheck } from "./foot-slip";
import { groundPenetrationCheck } from "./ground-penetration";
import { jointLimitCheck } from "./joint-limit";
import { jointSpeedCheck } from "./joint-speed";
import { legClearanceCheck } from "./leg-clearance";
import { loopJumpCheck } from "./loop-jump";
import { lowMarginCheck } from "./low-margin";
import { pulseRangeCheck } from "./pulse-range";
import { supportCountCheck } from "./support-count";
import { unreachableCheck } from "./unreachable";

export const CHECKS: readonly Check[] = [
  unreachableCheck,
  jointLimitCheck,
  jointSpeedCheck,
  pulseRangeCheck,
  groundPenetrationCheck,
  footSlipCheck,
  supportCountCheck,
  comOutsideCheck,
  lowMarginCheck,
  legClearanceCheck,
  loopJumpCheck,
];

export type { Check, CheckContext, SolveState } from "./check";
