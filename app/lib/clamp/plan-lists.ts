// The fixed lists of the model's input, apart from the schema (schema.ts) so a form or a page can name
// them without loading zod or the schema with its first JavaScript.
export { TIGHTENING_METHODS } from "./torque";
export const GASKET_TYPES = ["solid-copper", "mls", "mls-with-ring", "fire-ring"] as const;
/** Engine layouts the model reads (a V needs an even cylinder count). */
export const LAYOUTS = ["inline", "V"] as const;
export const ROUGHNESS = ["rz-under-10", "rz-10-40", "rz-40-160"] as const;
