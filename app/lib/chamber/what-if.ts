// The chamber page's "what if the gasket were this thick" figure, as typed in the person's units.
import { parseQuantity, unitFor, type UnitSystem } from "../units";

/** A compressed gasket thickness the what-if accepts, SI mm (exclusive bounds). */
export const WHAT_IF_THICKNESS_MM = { min: 0, max: 10 } as const;

/**
 * The typed thickness → mm, or the message to show; blank text is no what-if (both null).
 * A unit typed after the number wins over the field's.
 */
export function readWhatIfThickness(text: string, units: UnitSystem): { thicknessMm: number | null; error: string | null } {
  if (!text.trim()) return { thicknessMm: null, error: null };
  const r = parseQuantity(text, "smallLength", unitFor("smallLength", units));
  if (!r.ok) return { thicknessMm: null, error: r.message };
  if (!(r.valueSi > WHAT_IF_THICKNESS_MM.min && r.valueSi < WHAT_IF_THICKNESS_MM.max))
    return {
      thicknessMm: null,
      error: `Give a compressed thickness between ${WHAT_IF_THICKNESS_MM.min} and ${WHAT_IF_THICKNESS_MM.max} mm`,
    };
  return { thicknessMm: r.valueSi, error: null };
}
