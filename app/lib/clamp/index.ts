// The clamp model's public API. SI inside: mm, N, N·m, MPa, °C.
export { PlanInputSchema, StudSchema, parsePlan, gripLengthMm, GASKET_TYPES, TIGHTENING_METHODS, ROUGHNESS } from "./schema";
export type { PlanInput, PlanInputRaw, Stud } from "./schema";
export { defaultStudPattern } from "./pattern";
export { evaluatePlan, type EvaluateOptions, type PlanEstimate, type CylinderEstimate, type StudEstimate } from "./evaluate";
export { torqueSweep, type SweepOptions, type SweepPoint, type SweepResult } from "./sweep";
export {
  torqueCeiling,
  sealGainPer10,
  headSqueeze,
  headSqueezeOnset,
  CEILING_WORDS,
  type Ceiling,
  type CeilingCause,
  type SealGain,
  type HeadSqueeze,
} from "./ceiling";
export {
  verdictFor,
  bandSeal,
  workingState,
  rankChecks,
  TORSION_RELIEF,
  type Verdict,
  type LimitCheck,
  type CheckId,
  type Status,
  type WorkingState,
} from "./limits";
export { REMEDIES, remediesFor } from "./warnings";
export { TYPICAL_GASKETS, ANNEALED_COPPER_HARDNESS_MPA, type TypicalGasket, type GasketFamily } from "./gasket-families";
export { SI_WORDING, type Wording } from "./wording";
export { uncertainty, mulberry32, type UncertaintyOptions, type UncertaintyResult } from "./uncertainty";
export { suggest, type SuggestOptions, type Suggestion } from "./suggest";
export { prepare, type Prepared } from "./model";
export { threadGeometry, looksUnified, unifiedStressAreaIn2, circleAreaMm2, type ThreadGeometry } from "./thread";
export {
  torqueForPreload,
  preloadFromTorque,
  torquePerPreloadMm,
  equivalentNutFactor,
  bearingDiameterMm,
  frictionFaceOdMm,
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
  loadFactorAtInnerPlane,
  WILEMAN,
} from "./stiffness";
export {
  asmeRequirement,
  sealRequirement,
  loadBore,
  moveBore,
  ringLoadPlateCompliance,
  effectiveGapMm,
  sealLineStiffness,
  gasketBodyStiffness,
  type SealRequirement,
  type BorePaths,
  type PathElement,
  type BoreState,
} from "./seal";
export { thermalPreloadChangeN, embeddingMm, embeddingLossN, EMBEDDING_UM, type Roughness } from "./thermal";
export {
  HANDBOOK_MATERIALS,
  LIMITING_SURFACE_PRESSURE_MPA,
  FASTENER_CLASSES,
  ASME_GASKET_FACTORS,
  type HandbookMaterial,
} from "./handbook";
