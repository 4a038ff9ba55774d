/** Simulators of structures and records (public surface of lib/simulate). */
export { createRng, type Rng } from "./rng";
export type { StructuralMode } from "./modes";
export { shearFrameModes, modesOfShearModel } from "./shear-frame";
export { simplySupportedBeamModes, cantileverBeamModes, type BeamOptions } from "./beams";
export { simulateAmbientRecord, type AmbientOptions, type AmbientRecord, type SimulatedMode } from "./ambient";
export { applyDefects, type RecordDefect, type DefectResult } from "./defects";
export { frequencyAtTemperature, type TemperatureSensitivity } from "./temperature";
export { simulateForcedTest, type ForcedTestOptions, type ForcedTestRecord, type ForcedExcitation } from "./forced";
