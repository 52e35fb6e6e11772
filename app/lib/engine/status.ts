// The engine statuses, apart from the schema so pages that only show them do not load zod.
export const ENGINE_STATUSES = ["quoted", "in-build", "running", "retired"] as const;
export type EngineStatus = (typeof ENGINE_STATUSES)[number];
