// The robot views, shared by the robot page and the gait editor.
export { RobotViews, groundRings, type RobotViewsProps } from "./RobotViews";
export { TopView, type TopViewProps } from "./TopView";
export { SideView, type SideViewProps } from "./SideView";
export { legPostures, type LegPosture } from "./leg-postures";
export { legBackground, legFill, legStroke } from "./leg-colours";
export { sideFrame, topFrame, type ViewFrame } from "./frame";
