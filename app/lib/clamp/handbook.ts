// Handbook values (docs/references.md §6–§7), each with its source, for seeding libraries and for tests.
// Typical or minimum as noted; a shop's own data beats these.

export interface HandbookMaterial {
  name: string;
  modulusMpa: number;
  /** Yield (0.2 % proof) where the source gives one. */
  yieldMpa?: number;
  expansionUmPerMC: number;
  source: string;
}

export const HANDBOOK_MATERIALS: Record<string, HandbookMaterial> = {
  "a356-t6": {
    name: "A356.0-T6 cast aluminium (sand, minimum)",
    modulusMpa: 72_400,
    yieldMpa: 165,
    expansionUmPerMC: 21.4,
    source: "Aluminum Association data via MatWeb",
  },
  "6061-t6": { name: "6061-T6 wrought aluminium", modulusMpa: 68_900, yieldMpa: 276, expansionUmPerMC: 23.6, source: "MatWeb" },
  "7075-t6": { name: "7075-T6 wrought aluminium", modulusMpa: 71_700, yieldMpa: 503, expansionUmPerMC: 23.4, source: "MatWeb" },
  "gray-iron-30-40": {
    name: "Gray cast iron, class 30–40",
    modulusMpa: 100_000,
    expansionUmPerMC: 10.8,
    source: "ASTM A48; Shigley table A-5",
  },
  "ductile-65-45-12": { name: "Ductile iron 65-45-12", modulusMpa: 169_000, yieldMpa: 310, expansionUmPerMC: 11.5, source: "ASTM A536" },
  "4340-qt": {
    name: "4340 steel, quenched and tempered (425 °C)",
    modulusMpa: 205_000,
    yieldMpa: 1379,
    expansionUmPerMC: 12.3,
    source: "MatWeb",
  },
  "stainless-300-wire": {
    name: "300-series stainless wire (annealed)",
    modulusMpa: 193_000,
    yieldMpa: 207,
    expansionUmPerMC: 17.3,
    source: "MatWeb",
  },
  "c11000-annealed": {
    name: "C11000 copper, annealed",
    modulusMpa: 115_000,
    yieldMpa: 70,
    expansionUmPerMC: 17.0,
    source: "copper producer data sheet",
  },
};

/** Limiting surface pressure under washers, MPa (VDI 2230, 2003 edition, as quoted by a fastener catalogue). */
export const LIMITING_SURFACE_PRESSURE_MPA: Record<string, number> = {
  "AlSi7Mg heat-treated (cast)": 380,
  "AlSi9Cu3 die cast": 290,
  AlMgSi1: 260,
  "GJL-250 gray iron": 900,
  "GJS-500 ductile iron": 900,
};

/** Fastener class strengths, MPa: ISO 898-1 proof stresses; SAE J429 grade 8 in ksi converted (NIST SP 811). */
export const FASTENER_CLASSES = {
  "iso-10.9": { proofMpa: 830, source: "ISO 898-1" },
  "iso-12.9": { proofMpa: 970, source: "ISO 898-1" },
  // SAE J429: proof 120 ksi, yield 130 ksi, tensile 150 ksi; 1 ksi = 6.894757 MPa
  "sae-grade-8": { proofMpa: 120 * 6.894757, yieldMpa: 130 * 6.894757, tensileMpa: 150 * 6.894757, source: "SAE J429" },
} as const;

/** ASME BPVC VIII-1 Table 2-5.1 gasket factors: flange design values, a conservative criterion only. */
export const ASME_GASKET_FACTORS: Record<string, { m: number; yPsi: number }> = {
  "solid flat copper": { m: 4.75, yPsi: 13_000 },
  "solid flat soft steel": { m: 5.5, yPsi: 18_000 },
  "solid flat stainless": { m: 6.5, yPsi: 26_000 },
  "solid flat aluminium": { m: 4.0, yPsi: 8_800 },
  "corrugated metal, copper": { m: 3.0, yPsi: 4_500 },
  "ring joint, soft steel": { m: 5.5, yPsi: 18_000 },
  "spiral-wound stainless": { m: 3.0, yPsi: 10_000 },
};
