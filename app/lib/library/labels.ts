// The library's kinds and their words, apart from the record schemas (./schemas): pages that only
// show a gasket type or a material kind load them without zod.
import { GASKET_TYPES } from "../clamp/plan-lists";

export const MATERIAL_KINDS = ["aluminium", "iron", "steel", "stainless", "copper", "other"] as const;
export const THREAD_SYSTEMS = ["metric", "unified"] as const;
// the clamp model's list is the one source; the library offers every type the model reads
export const LIBRARY_GASKET_TYPES = GASKET_TYPES;
export const LIBRARY_KINDS = ["fasteners", "gaskets", "materials"] as const;
export type LibraryKind = (typeof LIBRARY_KINDS)[number];

export const MATERIAL_KIND_LABELS: Record<(typeof MATERIAL_KINDS)[number], string> = {
  aluminium: "Aluminium",
  iron: "Iron",
  steel: "Steel",
  stainless: "Stainless steel",
  copper: "Copper",
  other: "Other",
};

export const GASKET_TYPE_LABELS: Record<(typeof LIBRARY_GASKET_TYPES)[number], string> = {
  "solid-copper": "Solid copper (wire ring optional)",
  mls: "Multilayer steel",
  "mls-with-ring": "Multilayer steel, ring in the sleeve",
  "fire-ring": "Fire-ring style",
};

export function isLibraryKind(s: string | undefined): s is LibraryKind {
  return (LIBRARY_KINDS as readonly string[]).includes(s ?? "");
}
