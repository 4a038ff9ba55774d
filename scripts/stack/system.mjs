// Machine set-up for a fresh clone: npm packages and Debian packages.
import fs from "node:fs";
import path from "node:path";
import { log, run, sleep } from "./proc.mjs";

/** Install npm packages with `npm ci` when node_modules is missing or older than the lockfile. */
export async function ensureNodeModules(root) {
  const lock = path.join(root, "package-lock.json");
  const installed = path.join(root, "node_modules", ".package-lock.json");
  let reason = null;
  if (!fs.existsSync(installed)) reason = "node_modules missing";
  else if (fs.statSync(lock).mtimeMs > fs.statSync(installed).mtimeMs + 1000) reason = "package-lock.json is newer than node_modules";
  if (!reason) return false;
  log("stack", `${reason}: npm ci (about a minute)`);
  await run("npm", ["ci", "--no-audit", "--no-fund"], { cwd: root, inherit: true });
  return true;
}

function commandExists(file) {
  try {
    fs.accessSync(file, fs.constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

/** Wait while another apt/dpkg run holds the package database (never start a second one). */
async function waitForApt() {
  let announced = false;
  for (;;) {
    const { code } = await run("pgrep", ["-x", "apt|apt-get|dpkg|unattended-upgr"], { allowFail: true });
    if (code !== 0) return;
    if (!announced) log("stack", "another apt/dpkg run is in progress; waiting for it");
    announced = true;
    await sleep(2000);
  }
}

/**
 * Make sure `binary` exists, installing Debian package `pkg` with apt-get if it does not
 * (root only). Retries once after `apt-get update` when the package lists are stale.
 */
export async function ensureDebianPackage(binary, pkg) {
  if (commandExists(binary)) return false;
  await waitForApt();
  if (commandExists(binary)) return false;
  if (process.getuid?.() !== 0) throw new Error(`${binary} is missing; install Debian package ${pkg} (needs root)`);
  log("stack", `${binary} missing: apt-get install -y ${pkg}`);
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  const first = await run("apt-get", ["install", "-y", pkg], { env, allowFail: true, inherit: true });
  if (first.code !== 0) {
    await run("apt-get", ["update"], { env, inherit: true });
    await run("apt-get", ["install", "-y", pkg], { env, inherit: true });
  }
  if (!commandExists(binary)) throw new Error(`installed ${pkg} but ${binary} is still missing`);
  return true;
}
