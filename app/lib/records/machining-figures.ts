// The machining record's single figures (labels, quantities, bounds in SI), apart from the form's schema
// in ./machining: the machining page shows them with its first JavaScript, without zod or the clamp model.

/** The single figures of the form, with their quantity and bounds in SI. */
export const MACHINING_FIGURE_BOUNDS = [
  // a face out of flat by half a millimetre is scrap, not a measurement to record
  ["headFlatnessMm", "Head flatness", "smallLength", 0, 0.5],
  ["deckFlatnessMm", "Deck flatness", "smallLength", 0, 0.5],
  ["headFinishUm", "Head surface finish", "roughness", 0.01, 25],
  ["deckFinishUm", "Deck surface finish", "roughness", 0.01, 25],
  ["headRemovedMm", "Material taken off the head", "smallLength", 0, 5],
  ["deckRemovedMm", "Material taken off the deck", "smallLength", 0, 5],
  // the same bounds as the clamp model's schema for the plan's figures
  ["wireProjectionMm", "Wire-ring projection", "smallLength", 0, 2],
  ["receiverGrooveDepthMm", "Receiver-groove depth", "smallLength", 0, 2],
  ["gasketCompressedMm", "Gasket compressed thickness", "smallLength", 0.1, 10],
] as const;
export type MachiningFigure = (typeof MACHINING_FIGURE_BOUNDS)[number][0];
export const MACHINING_FIGURES: readonly { name: MachiningFigure; label: string; quantity: "smallLength" | "roughness" }[] =
  MACHINING_FIGURE_BOUNDS.map(([name, label, quantity]) => ({ name, label, quantity }));
