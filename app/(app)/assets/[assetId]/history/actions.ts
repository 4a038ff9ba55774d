"use server";

import { createHash } from "node:crypto";
import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { AppError } from "@/lib/http/errors";
import { importModalHistory, previewModalHistory } from "@/lib/services/drift/history-import.service";

const file = z.instanceof(File, { error: "Choose a CSV file." }).refine((f) => f.size > 0, "The file is empty.");

/** Dry run: what the file holds and every bad row; nothing is written. */
export const previewHistoryAction = defineAction(z.object({ assetId: z.uuid("No such asset."), file }), async ({ assetId, file: f }, actor) => {
  const p = await previewModalHistory(actor, assetId, await f.text());
  return {
    fileName: f.name, source: p.source, rows: p.rows, from: p.from?.toISOString() ?? null, to: p.to?.toISOString() ?? null,
    modes: p.modes, errors: p.errors, alreadyImported: p.alreadyImported,
    firstRows: p.firstRows.map((r) => ({ line: r.line, at: r.at.toISOString(), mode: r.mode, frequencyHz: r.frequencyHz, dampingRatio: r.dampingRatio, temperatureC: r.temperatureC })),
  };
});

/** Import the previewed file (the same bytes: its hash must match the preview's). */
export const importHistoryAction = defineAction(
  z.object({ assetId: z.uuid("No such asset."), file, source: z.string().regex(/^import:[0-9a-f]{64}$/, "Preview the file first.") }),
  async ({ assetId, file: f, source }, actor) => {
    const text = await f.text();
    if (`import:${createHash("sha256").update(text).digest("hex")}` !== source) {
      throw new AppError("conflict", "The file changed since its preview: preview it again before importing.");
    }
    const s = await importModalHistory(actor, assetId, text);
    revalidatePath(`/assets/${assetId}`, "layout");
    return { rows: s.rows, imported: s.imported, modes: s.modes, from: s.from.toISOString(), to: s.to.toISOString() };
  },
);
