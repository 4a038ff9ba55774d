/** Number formatting of the serviceability screens. */
export const hz = (v: number | null | undefined, digits = 3) => (v === null || v === undefined ? "—" : `${v.toFixed(digits)} Hz`);
export const mps2 = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v < 0.01 ? v.toExponential(2) : v.toFixed(3)} m/s²`);
export const pct = (v: number | null | undefined, digits = 2) => (v === null || v === undefined ? "—" : `${(v * 100).toFixed(digits)} %`);
export const mps = (v: number | null | undefined) => (v === null || v === undefined ? "—" : `${v.toFixed(2)} m/s`);
