// Leg colours from the theme's colour-blind-safe palette (app/app.css, --color-leg-1..8).
// Written out in full so Tailwind sees every class name.
const STROKES = ["stroke-leg-1", "stroke-leg-2", "stroke-leg-3", "stroke-leg-4", "stroke-leg-5", "stroke-leg-6", "stroke-leg-7", "stroke-leg-8"];
const FILLS = ["fill-leg-1", "fill-leg-2", "fill-leg-3", "fill-leg-4", "fill-leg-5", "fill-leg-6", "fill-leg-7", "fill-leg-8"];
const BACKGROUNDS = ["bg-leg-1", "bg-leg-2", "bg-leg-3", "bg-leg-4", "bg-leg-5", "bg-leg-6", "bg-leg-7", "bg-leg-8"];

export const legStroke = (index: number) => STROKES[index % STROKES.length];
export const legFill = (index: number) => FILLS[index % FILLS.length];
export const legBackground = (index: number) => BACKGROUNDS[index % BACKGROUNDS.length];
