import { execFile } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { shearFrameModes, simulateAmbientRecord } from "@/lib/simulate";

// The `identify` command line of issue 3 item 8, run as a user runs it (a child process on
// files). Frequencies are checked against the closed form of a uniform 3-storey shear
// building, ω_j = 2√(k/m)·sin((2j−1)π/(2(2N+1))) [Chopra, Dynamics of Structures, MDOF
// chapters; REFERENCES.md: ω/√(k/m) = 0.445042, 1.246980, 1.801938].

const ROOT = path.resolve(__dirname, "../..");
const CHANNELS = ["S1", "S2", "S3"];
const K = 2.0e6; // N/m per storey
const M = 1.0e4; // kg per storey
const expectedHz = [0.445042, 1.24698, 1.801938].map((r) => (r * Math.sqrt(K / M)) / (2 * Math.PI));

interface CliResult { code: number; stdout: string; stderr: string }

function runCli(args: string[]): Promise<CliResult> {
  return new Promise((resolve) => {
    execFile(
      process.execPath,
      ["--import", "tsx", path.join(ROOT, "scripts/identify.ts"), ...args],
      { cwd: ROOT, maxBuffer: 16 * 1024 * 1024 },
      (err, stdout, stderr) => resolve({ code: err ? Number((err as { code?: number }).code ?? 1) : 0, stdout, stderr }),
    );
  });
}

let dir = "";
const fs = 50;

beforeAll(() => {
  dir = mkdtempSync(path.join(tmpdir(), "mw-identify-"));
  const modes = shearFrameModes(3, K, M).map((m) => ({ ...m, dampingRatio: 0.01 }));
  const rec = simulateAmbientRecord({ modes, sampleRateHz: fs, durationS: 1200, seed: 11 });
  const n = rec.data[0].length;
  const rows = [CHANNELS.join(",")];
  for (let t = 0; t < n; t++) rows.push(CHANNELS.map((_, i) => rec.data[i][t].toPrecision(8)).join(","));
  writeFileSync(path.join(dir, "rec.csv"), rows.join("\n") + "\n");
  const f32 = new Float32Array(n * CHANNELS.length);
  for (let t = 0; t < n; t++) for (let i = 0; i < CHANNELS.length; i++) f32[t * CHANNELS.length + i] = rec.data[i][t];
  writeFileSync(path.join(dir, "rec.f32.gz"), gzipSync(Buffer.from(f32.buffer)));
  writeFileSync(
    path.join(dir, "rec.json"),
    JSON.stringify({ recordId: "cli-1", startedAt: "2026-11-01T00:00:00Z", sampleRateHz: fs, channels: CHANNELS, units: "m/s2", temperatureC: 4 }),
  );
  writeFileSync(path.join(dir, "ragged.csv"), "S1,S2,S3\n1,2,3\n4,5\n");
});

afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("npm run identify", () => {
  it("prints the modes of a CSV record within 0.3 % of the closed-form shear-frame frequencies", async () => {
    const r = await runCli(["--meta", path.join(dir, "rec.json"), "--data", path.join(dir, "rec.csv"), "--bands", "0.8-1.2,2.5-3.1,3.8-4.3"]);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as { modes: { frequencyHz: number; mpc: number; shape: Record<string, number>; halfPower: { q: number } }[] };
    expect(out.modes).toHaveLength(3);
    out.modes.forEach((m, j) => {
      expect(Math.abs(m.frequencyHz - expectedHz[j]) / expectedHz[j]).toBeLessThan(0.003);
      expect(Object.keys(m.shape)).toEqual(CHANNELS);
      expect(m.mpc).toBeGreaterThan(0.99);
      expect(m.halfPower.q).toBeGreaterThan(0);
    });
  });

  it("reads gzip-compressed float32 data to the same frequencies", async () => {
    const r = await runCli(["--meta", path.join(dir, "rec.json"), "--data", path.join(dir, "rec.f32.gz"), "--bands", "0.8-1.2,2.5-3.1,3.8-4.3"]);
    expect(r.code, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout) as { modes: { frequencyHz: number }[] };
    expect(out.modes.map((m) => m.frequencyHz).every((f, j) => Math.abs(f - expectedHz[j]) / expectedHz[j] < 0.003)).toBe(true);
  });

  it("refuses a ragged CSV with a message and a non-zero exit", async () => {
    const r = await runCli(["--meta", path.join(dir, "rec.json"), "--data", path.join(dir, "ragged.csv")]);
    expect(r.code).not.toBe(0);
    expect(r.stderr).toMatch(/row|column|line/i);
    expect(r.stdout).toBe("");
  });
});
