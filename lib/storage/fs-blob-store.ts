/**
 * Filesystem driver of the blob store (the embedded default): one file per key under
 * `<root>`, the content-addressed keys fanned out by their first hash characters so no
 * folder grows past a few thousand entries. Writes go to a temporary file in the same
 * folder and are renamed into place, so a crash never leaves a half-written blob.
 */
import { randomUUID } from "node:crypto";
import { mkdir, open, readFile, rename, rm, stat } from "node:fs/promises";
import path from "node:path";
import { assertBlobKey, type BlobStore } from "./blob-store";

export class FsBlobStore implements BlobStore {
  /** Folders known to exist (the fan-out has 65 536 leaves; skipping mkdir saves a thread-pool call per put). */
  private readonly folders = new Set<string>();

  constructor(private readonly root: string) {}

  /** File path of a key: `sha256/<hash>` → `<root>/sha256/ab/cd/<hash>`. */
  pathOf(key: string): string {
    assertBlobKey(key);
    const parts = key.split("/");
    const last = parts[parts.length - 1];
    const fan = last.length >= 4 ? [last.slice(0, 2), last.slice(2, 4)] : [];
    return path.join(this.root, ...parts.slice(0, -1), ...fan, last);
  }

  async put(key: string, bytes: Uint8Array): Promise<void> {
    const file = this.pathOf(key);
    if (await this.exists(file)) return;
    const folder = path.dirname(file);
    if (!this.folders.has(folder)) {
      await mkdir(folder, { recursive: true });
      this.folders.add(folder);
    }
    const tmp = `${file}.${randomUUID()}.tmp`;
    try {
      // One write call for the whole blob where the kernel takes it all (regular files do),
      // not writeFile's 512 KiB pieces: each piece is a thread-pool round trip that queues
      // behind every other upload's work.
      const handle = await open(tmp, "w").catch(async (e: unknown) => {
        if (!isNotFound(e)) throw e;
        // The folder went away since it was first made (cleaned up by hand): make it again.
        await mkdir(folder, { recursive: true });
        return open(tmp, "w");
      });
      try {
        for (let off = 0; off < bytes.length; ) off += (await handle.write(bytes, off, bytes.length - off)).bytesWritten;
      } finally {
        await handle.close();
      }
      await rename(tmp, file);
    } catch (e) {
      await rm(tmp, { force: true });
      throw e;
    }
  }

  async get(key: string): Promise<Uint8Array | null> {
    try {
      const buf = await readFile(this.pathOf(key));
      return new Uint8Array(buf.buffer, buf.byteOffset, buf.byteLength);
    } catch (e) {
      if (isNotFound(e)) return null;
      throw e;
    }
  }

  async has(key: string): Promise<boolean> {
    return this.exists(this.pathOf(key));
  }

  async delete(key: string): Promise<void> {
    await rm(this.pathOf(key), { force: true });
  }

  private async exists(file: string): Promise<boolean> {
    try {
      return (await stat(file)).isFile();
    } catch (e) {
      if (isNotFound(e)) return false;
      throw e;
    }
  }
}

function isNotFound(e: unknown): boolean {
  return typeof e === "object" && e !== null && (e as { code?: unknown }).code === "ENOENT";
}
