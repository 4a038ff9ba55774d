/**
 * Re-runs tests/reference/generate_fixtures.py with Debian's /usr/bin/python3 (SciPy/NumPy
 * from python3-scipy/python3-numpy) and checks the committed fixtures still agree [lib].
 * Skipped, with the reason in the test name, when that interpreter or SciPy is missing.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const PY = "/usr/bin/python3";
const probe = spawnSync(PY, ["-c", "import scipy, numpy"], { encoding: "utf8" });
const available = probe.status === 0;
const name = available
  ? "re-generated fixtures agree with the committed ones to 1e-9 (relative)"
  : "skipped: /usr/bin/python3 with scipy and numpy is not available";

function compare(a: unknown, b: unknown, where: string): void {
  if (typeof a === "number" && typeof b === "number") {
    const tol = 1e-9 * Math.max(1, Math.abs(a), Math.abs(b));
    if (Math.abs(a - b) > tol) throw new Error(`${where}: ${a} ≠ ${b}`);
    return;
  }
  if (Array.isArray(a) && Array.isArray(b)) {
    expect(a.length, where).toBe(b.length);
    a.forEach((v, i) => compare(v, b[i], `${where}[${i}]`));
    return;
  }
  if (a && b && typeof a === "object" && typeof b === "object") {
    for (const k of Object.keys(a)) if (k !== "versions") compare((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k], `${where}.${k}`);
    return;
  }
  expect(a, where).toEqual(b);
}

describe("reference fixtures", () => {
  it.skipIf(!available)(name, () => {
    const dir = mkdtempSync(path.join(tmpdir(), "modewarden-fixtures-"));
    try {
      const script = path.resolve(__dirname, "generate_fixtures.py");
      const run = spawnSync(PY, [script, dir], { encoding: "utf8", timeout: 60_000 });
      expect(run.status, run.stderr).toBe(0);
      for (const f of ["welch-csd.json", "hermitian-svd.json", "conditioning.json"]) {
        const fresh = JSON.parse(readFileSync(path.join(dir, f), "utf8"));
        const committed = JSON.parse(readFileSync(path.resolve(__dirname, "fixtures", f), "utf8"));
        compare(fresh, committed, f);
      }
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  }, 60_000);
});
