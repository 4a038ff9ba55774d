"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { defineAction } from "@/lib/http/define-action";
import { createDesignMode, deleteDesignMode, updateDesignMode } from "@/lib/services/design/design.service";
import { DesignModeInput, foldShapeFields } from "@/lib/services/design/schemas";

const assetId = z.uuid("No such asset.");

/** Add a design (FE) mode (engineers, admins). */
export const createDesignModeAction = defineAction(z.preprocess(foldShapeFields, DesignModeInput.extend({ assetId })), async ({ assetId: id, ...input }, actor) => {
  const mode = await createDesignMode(actor, id, input);
  revalidatePath(`/assets/${id}`, "layout");
  return { id: mode.id, label: mode.label };
});

/** Edit a design mode (engineers, admins). */
export const updateDesignModeAction = defineAction(
  z.preprocess(foldShapeFields, DesignModeInput.extend({ assetId, designModeId: z.uuid("No such design mode.") })),
  async ({ assetId: id, designModeId, ...input }, actor) => {
    const mode = await updateDesignMode(actor, id, designModeId, input);
    revalidatePath(`/assets/${id}`, "layout");
    return { id: mode.id, label: mode.label };
  },
);

/** Remove a design mode (engineers, admins). */
export const deleteDesignModeAction = defineAction(z.object({ assetId, designModeId: z.uuid("No such design mode.") }), async ({ assetId: id, designModeId }, actor) => {
  await deleteDesignMode(actor, id, designModeId);
  revalidatePath(`/assets/${id}`, "layout");
  return { id: designModeId };
});
