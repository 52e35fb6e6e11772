export {
  compressionRatio,
  compressionRatioFromVolumes,
  quenchMm,
  gasketThicknessWhatIf,
  chamberProblems,
  type ChamberVolumes,
  type CompressionInput,
  type CompressionResult,
  type ThicknessWhatIf,
} from "./compression";
export { estimatePeakPressure, type PeakPressureInput, type PeakPressureEstimate } from "./peak-pressure";
