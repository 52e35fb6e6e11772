// The fixed lists of the model's input, apart from the schema (schema.ts) so a form or a page can name
// them without loading zod or the schema with its first JavaScript.
export const GASKET_TYPES = ["solid-copper", "mls", "mls-with-ring", "fire-ring"] as const;
export const TIGHTENING_METHODS = ["torque-estimated-friction", "torque-tested-friction", "angle-or-yield", "stretch-measured"] as const;
export const ROUGHNESS = ["rz-under-10", "rz-10-40", "rz-40-160"] as const;
