import { describe, expect, it } from "vitest";
import { cantileverBeamModes, simplySupportedBeamModes, type BeamOptions } from "@/lib/simulate/beams";

const base: BeamOptions = {
  lengthM: 12,
  flexuralRigidityNm2: 3.2e8,
  massPerLengthKgPerM: 850,
  sensorPositionsM: [0, 3, 6, 9, 12],
  modeCount: 3,
};
/** β_nL from f_n = (β_nL)²/(2πL²)·√(EI/m). */
const betaL = (f: number, o: BeamOptions) =>
  Math.sqrt((f * 2 * Math.PI * o.lengthM ** 2) / Math.sqrt(o.flexuralRigidityNm2 / o.massPerLengthKgPerM));

describe("cantileverBeamModes", () => {
  it("has the β_nL of Blevins: 1.875104, 4.694091, 7.854757", () => {
    // Blevins, Formulas for Natural Frequency and Mode Shape [pub].
    const modes = cantileverBeamModes(base);
    [1.875104, 4.694091, 7.854757].forEach((b, i) => expect(betaL(modes[i].frequencyHz, base)).toBeCloseTo(b, 6));
  });

  it("is zero at the clamp and +1 at the tip, with n − 1 interior nodes", () => {
    const fine = { ...base, sensorPositionsM: Array.from({ length: 401 }, (_, i) => (i * 12) / 400), modeCount: 6 };
    cantileverBeamModes(fine).forEach((mode, j) => {
      expect(Math.abs(mode.shape[0])).toBeLessThan(1e-12);
      expect(mode.shape[400]).toBeCloseTo(1, 12);
      let nodes = 0;
      for (let i = 2; i < 400; i++) if (mode.shape[i] * mode.shape[i - 1] < 0) nodes++;
      expect(nodes).toBe(j);
      expect(Math.max(...mode.shape.map(Math.abs))).toBeLessThanOrEqual(1 + 1e-12);
    });
  });
});

describe("simplySupportedBeamModes", () => {
  it("has β_nL = nπ and sin(nπx/L) shapes", () => {
    // Blevins [pub]: simply supported β_nL = nπ.
    const modes = simplySupportedBeamModes(base);
    modes.forEach((mode, i) => {
      expect(betaL(mode.frequencyHz, base)).toBeCloseTo((i + 1) * Math.PI, 10);
      base.sensorPositionsM.forEach((x, s) => expect(mode.shape[s]).toBeCloseTo(Math.sin(((i + 1) * Math.PI * x) / 12), 12));
    });
  });

  it("refuses sensors off the beam, bad properties and mode counts", () => {
    expect(() => simplySupportedBeamModes({ ...base, sensorPositionsM: [13] })).toThrow(/sensorPositionsM\[0\] must be within \[0, 12\] m \(got 13\)/);
    expect(() => simplySupportedBeamModes({ ...base, lengthM: 0 })).toThrow(RangeError);
    expect(() => cantileverBeamModes({ ...base, modeCount: 0 })).toThrow(RangeError);
    expect(() => cantileverBeamModes({ ...base, flexuralRigidityNm2: NaN })).toThrow(TypeError);
    expect(() => cantileverBeamModes(null as unknown as BeamOptions)).toThrow(TypeError);
  });
});
