// The template names (trade names, DESIGN.md "Gait sequence"), apart from the
// generators so that the sequence schema can name them without importing them.
export const TEMPLATE_NAMES = ["tripod", "tetrapod", "ripple", "wave", "trot", "alternating-tetrapod", "custom"] as const;
export type TemplateName = (typeof TEMPLATE_NAMES)[number];
