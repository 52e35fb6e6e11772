// Handbook values (docs/references.md §6–§7), each with its source: the one copy that the shop's
// starting library is seeded from (app/lib/library/seed-data.ts) and that the tests check.
// Typical or minimum as noted; a shop's own data beats these.

/** Limiting surface pressure under washers, MPa (VDI 2230, 2003 edition, as quoted by a fastener catalogue). */
export const LIMITING_SURFACE_PRESSURE_MPA = {
  "AlSi7Mg heat-treated (cast)": 380,
  "AlSi9Cu3 die cast": 290,
  AlMgSi1: 260,
  "GJL-250 gray iron": 900,
  "GJS-500 ductile iron": 900,
} as const satisfies Record<string, number>;

/** MPa per ksi (NIST SP 811: 1 psi = 6894.757 Pa). */
export const MPA_PER_KSI = 6.894757;

/** Fastener class strengths, MPa: ISO 898-1 proof stresses; SAE J429 grade 8 in ksi converted (NIST SP 811). */
export const FASTENER_CLASSES = {
  "iso-10.9": { proofMpa: 830, source: "ISO 898-1" },
  "iso-12.9": { proofMpa: 970, source: "ISO 898-1" },
  // SAE J429: proof 120 ksi, yield 130 ksi, tensile 150 ksi
  "sae-grade-8": { proofMpa: 120 * MPA_PER_KSI, yieldMpa: 130 * MPA_PER_KSI, tensileMpa: 150 * MPA_PER_KSI, source: "SAE J429" },
} as const;

/** ASME BPVC VIII-1 Appendix 2 Table 2-5.1 gasket factors: flange design values, a conservative criterion only. */
export const ASME_GASKET_FACTORS = {
  "solid flat copper": { m: 4.75, yPsi: 13_000 },
  "solid flat soft steel": { m: 5.5, yPsi: 18_000 },
  "solid flat stainless": { m: 6.5, yPsi: 26_000 },
  "solid flat aluminium": { m: 4.0, yPsi: 8_800 },
  "corrugated metal, copper": { m: 3.0, yPsi: 4_500 },
  "ring joint, soft steel": { m: 5.5, yPsi: 18_000 },
  "spiral-wound stainless": { m: 3.0, yPsi: 10_000 },
} as const satisfies Record<string, { m: number; yPsi: number }>;

export type MaterialKind = "aluminium" | "iron" | "steel" | "stainless" | "copper";

export interface HandbookMaterial {
  /** The library row's name, as the shop sees it. */
  name: string;
  kind: MaterialKind;
  modulusMpa: number;
  /** Yield (0.2 % proof) where the source gives one. */
  yieldMpa: number | null;
  expansionUmPerMC: number;
  limitingSurfacePressureMpa: number | null;
  shearStrengthMpa?: number;
  /** The book, edition and table each figure comes from, shown in the library's Source column. */
  source: string;
}

const LIMIT = "limiting surface pressure from VDI 2230 (2003) as quoted by a fastener catalogue";
const STUD_MEMORY = "modulus 205 GPa and expansion 12 µm/m·°C from memory";

export const HANDBOOK_MATERIALS = {
  "a356-t6": {
    name: "A356.0-T6 cast aluminium",
    kind: "aluminium",
    modulusMpa: 72_400,
    yieldMpa: 165,
    expansionUmPerMC: 21.4,
    limitingSurfacePressureMpa: LIMITING_SURFACE_PRESSURE_MPA["AlSi7Mg heat-treated (cast)"],
    source: `Aluminum Association data via MatWeb, sand-cast minimum yield; ${LIMIT}: cast AlSi7Mg heat-treated, the closest listed alloy`,
  },
  "6061-t6": {
    name: "6061-T6 wrought aluminium",
    kind: "aluminium",
    modulusMpa: 68_900,
    yieldMpa: 276,
    expansionUmPerMC: 23.6,
    limitingSurfacePressureMpa: LIMITING_SURFACE_PRESSURE_MPA.AlMgSi1,
    source: `MatWeb; ${LIMIT}: AlMgSi1, the closest listed alloy`,
  },
  "7075-t6": {
    name: "7075-T6 wrought aluminium",
    kind: "aluminium",
    modulusMpa: 71_700,
    yieldMpa: 503,
    expansionUmPerMC: 23.4,
    limitingSurfacePressureMpa: null,
    source: "MatWeb; no close alloy in the VDI 2230 list, so no limiting surface pressure is given",
  },
  "gray-iron-30-40": {
    name: "Gray cast iron, class 30–40",
    kind: "iron",
    modulusMpa: 100_000,
    yieldMpa: null,
    expansionUmPerMC: 10.8,
    limitingSurfacePressureMpa: LIMITING_SURFACE_PRESSURE_MPA["GJL-250 gray iron"],
    // Shigley table A-24 (from memory): class 30 gray iron, torsional shear strength 40 kpsi = 276 MPa
    shearStrengthMpa: 276,
    source: `ASTM A48; Shigley table A-5, no yield point (UTS ≥ 207–276 MPa); shear strength 40 kpsi for class 30, Shigley table A-24 (from memory); ${LIMIT}: GJL-250, the closest listed grade`,
  },
  "ductile-65-45-12": {
    name: "Ductile iron 65-45-12",
    kind: "iron",
    modulusMpa: 169_000,
    yieldMpa: 310,
    expansionUmPerMC: 11.5,
    limitingSurfacePressureMpa: LIMITING_SURFACE_PRESSURE_MPA["GJS-500 ductile iron"],
    source: `ASTM A536; ${LIMIT}: GJS-500, the closest listed grade`,
  },
  "4340-qt": {
    name: "4340 steel, quenched and tempered",
    kind: "steel",
    modulusMpa: 205_000,
    yieldMpa: 1379,
    expansionUmPerMC: 12.3,
    limitingSurfacePressureMpa: null,
    source: "MatWeb, tempered at 425 °C; no steel in the VDI 2230 list quoted there",
  },
  "stainless-300-wire": {
    name: "300-series stainless wire, annealed",
    kind: "stainless",
    modulusMpa: 193_000,
    yieldMpa: 207,
    expansionUmPerMC: 17.3,
    limitingSurfacePressureMpa: null,
    source: "MatWeb, annealed",
  },
  "c11000-annealed": {
    name: "C11000 copper, annealed",
    kind: "copper",
    modulusMpa: 115_000,
    yieldMpa: 70,
    expansionUmPerMC: 17.0,
    limitingSurfacePressureMpa: null,
    source: "Copper producer data sheet, annealed; yield about 70 MPa",
  },
  "stud-iso-12.9": {
    name: "Alloy steel stud, ISO 898-1 class 12.9",
    kind: "steel",
    modulusMpa: 205_000,
    yieldMpa: FASTENER_CLASSES["iso-12.9"].proofMpa,
    expansionUmPerMC: 12,
    limitingSurfacePressureMpa: null,
    source: `ISO 898-1: proof stress 970 MPa, used here as the yield (conservative); ${STUD_MEMORY}`,
  },
  "stud-sae-grade-8": {
    name: "Alloy steel stud, SAE J429 grade 8",
    kind: "steel",
    modulusMpa: 205_000,
    // 130 ksi × 6.894757 MPa/ksi (NIST SP 811), stored to 0.1 MPa
    yieldMpa: Math.round(FASTENER_CLASSES["sae-grade-8"].yieldMpa * 10) / 10,
    expansionUmPerMC: 12,
    limitingSurfacePressureMpa: null,
    source: `SAE J429 grade 8: yield 130 ksi (896 MPa), proof 120 ksi; ${STUD_MEMORY}`,
  },
} as const satisfies Record<string, HandbookMaterial>;
