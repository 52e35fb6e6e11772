// The engine record's pure parts: schema, form mapping, display units, words.
export * from "./schema";
export * from "./form";
export * from "./labels";
