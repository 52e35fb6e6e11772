// The clamp model's public API. SI inside: mm, N, N·m, MPa, °C.
export { PlanInputSchema, StudSchema, parsePlan, gripLengthMm, GASKET_TYPES, TIGHTENING_METHODS, ROUGHNESS } from "./schema";
export type { PlanInput, PlanInputRaw, Stud } from "./schema";
export { defaultStudPattern } from "./pattern";
export { evaluatePlan, type PlanEstimate, type CylinderEstimate, type StudEstimate } from "./evaluate";
export { torqueSweep, type SweepOptions, type SweepPoint, type SweepResult } from "./sweep";
export { squeezePoint, CAUSE_WORDS, type SqueezePoint, type SqueezeCause } from "./squeeze";
export { SI_WORDING, type Wording } from "./wording";
export { uncertainty, mulberry32, type UncertaintyOptions, type UncertaintyResult } from "./uncertainty";
export { suggest, type SuggestOptions, type Suggestion } from "./suggest";
export { prepare, type Prepared } from "./model";
export { threadGeometry, unifiedStressAreaIn2, circleAreaMm2, type ThreadGeometry } from "./thread";
export {
  torqueForPreload,
  preloadFromTorque,
  torquePerPreloadMm,
  equivalentNutFactor,
  bearingDiameterMm,
  preloadBand,
  tighteningStressPerN,
  tighteningStress,
  TIGHTENING_FACTOR,
  type TighteningMethod,
  type TorqueGeometry,
  type Friction,
  type PreloadBand,
} from "./torque";
export {
  studStiffness,
  shigleyBoltStiffness,
  seriesCompliance,
  frustumStiffness,
  memberStiffness,
  wilemanMemberStiffness,
  jointConstant,
  jointUnderLoad,
  WILEMAN,
} from "./stiffness";
export { asmeRequirement, splitClamp, unloadSealLine, effectiveGapMm, sealLineStiffness, gasketBodyStiffness } from "./seal";
export { thermalPreloadChangeN, embeddingMm, embeddingLossN, EMBEDDING_UM, type Roughness } from "./thermal";
export { HANDBOOK_MATERIALS, LIMITING_SURFACE_PRESSURE_MPA, FASTENER_CLASSES, ASME_GASKET_FACTORS, type HandbookMaterial } from "./handbook";
