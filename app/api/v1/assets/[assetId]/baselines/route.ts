import { z } from "zod";
import { defineRoute, json } from "@/lib/http/define-route";
import { fitAndActivateBaseline, listBaselines } from "@/lib/services/drift/baseline.service";
import { FitBaselineInput } from "@/lib/services/drift/schemas";

export const dynamic = "force-dynamic";

const Params = z.object({ assetId: z.uuid() });

/** `GET …/baselines` → `{ baselines }`, newest version first (the active one has `active: true`). */
export const GET = defineRoute({ auth: "user", params: Params }, async ({ actor, params }) =>
  json({ baselines: await listBaselines(actor, params.assetId) }));

/**
 * `POST …/baselines` (engineer, admin) `{ from, to, model?: 'auto'|'linear'|'bilinear' }` →
 * `201 { baseline }`, fitted on [from, to) and active; `422` when no mode has enough data.
 */
export const POST = defineRoute({ auth: "user", params: Params, body: FitBaselineInput }, async ({ actor, params, body }) =>
  json({ baseline: await fitAndActivateBaseline(actor, params.assetId, body) }, 201));
