// The Next.js app: build (skipped when .next already holds a build of this exact commit) and
// the demo sign-ins printed by the launcher.
import fs from "node:fs";
import path from "node:path";
import { formatDuration, log, run } from "./proc.mjs";

/** Node flags that load TypeScript through tsx (one process, so signals reach it). */
export const TSX = ["--import", "tsx"];

export const nextBin = (root) => path.join(root, "node_modules", "next", "dist", "bin", "next");

/**
 * Environment of the app server process (`next start`), for uploads of several megabytes:
 *  - glibc keeps freed blocks of up to 64 MiB in its heap for reuse, up to 256 MiB of them,
 *    instead of unmapping them and faulting fresh pages in for the next upload (each gzip
 *    upload inflates into a new ~8 MB buffer);
 *  - glibc asks for transparent huge pages for its heap (glibc.malloc.hugetlb=1, glibc ≥ 2.35;
 *    the kernel's THP mode here is `madvise`), so an 8 MB buffer is four 2 MiB pages instead of
 *    2048 small ones: fewer page faults and TLB misses, which are dear on this machine (a VM).
 * Measured by `npm run bench:ingest` (README, "Ingest performance").
 */
export const APP_PROCESS_ENV = {
  MALLOC_MMAP_THRESHOLD_: String(64 * 1024 * 1024),
  MALLOC_TRIM_THRESHOLD_: String(256 * 1024 * 1024),
  GLIBC_TUNABLES: "glibc.malloc.hugetlb=1",
};

async function gitState(root) {
  const head = await run("git", ["rev-parse", "HEAD"], { cwd: root, allowFail: true });
  const status = await run("git", ["status", "--porcelain"], { cwd: root, allowFail: true });
  if (head.code !== 0 || status.code !== 0) return null;
  return { commit: head.stdout.trim(), clean: status.stdout.trim() === "" };
}

/**
 * `next build` unless .next holds a build stamped with the current commit of a clean tree
 * (`force` always builds). Writes the stamp after a successful build of a clean tree.
 */
export async function buildIfNeeded(root, env, { force = false, logFile } = {}) {
  const stampFile = path.join(root, ".next", "modewarden-build.json");
  const git = await gitState(root);
  if (!force && git?.clean && fs.existsSync(path.join(root, ".next", "BUILD_ID")) && fs.existsSync(stampFile)) {
    const stamp = JSON.parse(fs.readFileSync(stampFile, "utf8"));
    if (stamp.commit === git.commit) {
      log("stack", `build of ${git.commit.slice(0, 8)} found in .next; not rebuilding`);
      return;
    }
  }
  log("stack", "next build (about a minute)");
  const t = Date.now();
  if (logFile) {
    const res = await run(process.execPath, [nextBin(root), "build"], { env: { ...env, NODE_ENV: "production" }, cwd: root, allowFail: true });
    fs.writeFileSync(logFile, res.stdout + res.stderr);
    if (res.code !== 0) throw new Error(`next build failed:\n${(res.stdout + res.stderr).split("\n").slice(-40).join("\n")}`);
  } else {
    await run(process.execPath, [nextBin(root), "build"], { env: { ...env, NODE_ENV: "production" }, cwd: root, inherit: true });
  }
  log("stack", `built in ${formatDuration(Date.now() - t)}`);
  if (git?.clean) fs.writeFileSync(stampFile, JSON.stringify({ commit: git.commit, builtAt: new Date().toISOString() }));
  else fs.rmSync(stampFile, { force: true });
}

/** Fallback when no seed module exports the demo users (PRODUCT.md / foundation contract). */
const FALLBACK_DEMO_USERS = [
  { role: "admin", email: "admin@larkspur.example", password: "(see db/seeds)" },
  { role: "engineer", email: "engineer@larkspur.example", password: "(see db/seeds)" },
  { role: "inspector", email: "inspector@larkspur.example", password: "(see db/seeds)" },
  { role: "owner", email: "owner@larkspur.example", password: "(see db/seeds)" },
];

/** The demo sign-ins exported by the seed modules (scripts/seed.ts --print-demo-users). */
export async function printDemoUsers(root, env) {
  const res = await run(process.execPath, [...TSX, path.join(root, "scripts/seed.ts"), "--print-demo-users"], { env, cwd: root, allowFail: true });
  const line = res.stdout.split("\n").find((l) => l.startsWith("DEMO_USERS "));
  try {
    const users = line ? JSON.parse(line.slice("DEMO_USERS ".length)) : null;
    if (Array.isArray(users) && users.length) return users;
  } catch {
    /* fall through */
  }
  return FALLBACK_DEMO_USERS;
}
