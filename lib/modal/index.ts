/**
 * Public surface of the modal identification engine (pure; no I/O, no app imports).
 */
export { identifyModes, type IdentifiedMode, type IdentifyResult, type IdentifyOptions, type ModalRecord } from "./identify";
export { decomposeCsdMatrix, type FddDecomposition } from "./fdd";
export { pickFddPeaks, type FddPeak, type PeakPickingOptions } from "./peak-picking";
export { estimateEfdd, fitLogDecrement, type EfddResult, type DecrementResult } from "./efdd";
export { halfPowerDamping, type HalfPowerResult } from "./half-power";
export { qualityFactor, lossFactor, logDecrementFromDampingRatio, dampingRatioFromLogDecrement } from "./damping";
export { mac, macReal, mpc } from "./mac";
export { realiseShape } from "./shape";
export { identifyModesSsiCov, type SsiCovResult, type SsiMode, type SsiCovOptions, type StabilisationPoint } from "./ssi-cov";
export { estimateFrfH1, type FrfEstimate, type ForcedRecord } from "./frf";
export { identifyFrfModes, type FrfMode, type FrfModeOptions } from "./frf-modes";
export { compareFrfWithAmbient, type ModePairing } from "./frf-compare";
