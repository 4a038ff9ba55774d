/**
 * Password reset by e-mail. Asking always answers the same (no account enumeration); the
 * link `${APP_URL}/reset/<token>` works once within RESET_VALID_MINUTES.
 */
import { db } from "@/lib/db/knex";
import { enqueueMail } from "@/lib/jobs/queues";
import { env } from "@/lib/config/env";
import { listMembershipsForUser } from "@/lib/db/repos/membership.repo";
import {
  findPasswordResetByTokenHash, insertPasswordReset, markPasswordResetsUsed,
} from "@/lib/db/repos/password-reset.repo";
import { findUserByEmail, findUserById, updateUserPassword } from "@/lib/db/repos/user.repo";
import { hashPassword } from "@/lib/auth/passwords";
import { generateSecret, hashSecret } from "@/lib/auth/tokens";
import { passwordResetEmail } from "@/lib/email/templates/password-reset";
import { AppError } from "@/lib/http/errors";
import { recordAudit } from "@/lib/services/audit/audit.service";
import type { RequestPasswordResetInput, ResetPasswordInput } from "./schemas";

export const RESET_VALID_MINUTES = 60;

/** Send a reset link if the account exists and is enabled; always resolves `{ ok: true }`. */
export async function requestPasswordReset(input: RequestPasswordResetInput): Promise<{ ok: true }> {
  const user = await findUserByEmail(db(), input.email);
  if (!user || user.disabled) return { ok: true };
  const secret = generateSecret();
  await insertPasswordReset(db(), {
    userId: user.id, tokenHash: secret.hash, expiresAt: new Date(Date.now() + RESET_VALID_MINUTES * 60_000),
  });
  const mail = passwordResetEmail({
    displayName: user.displayName, validMinutes: RESET_VALID_MINUTES,
    link: `${env().APP_URL.replace(/\/$/, "")}/reset/${secret.token}`,
  });
  await enqueueMail({ to: user.email, ...mail });
  return { ok: true };
}

/** Whether a reset link can still be used (the reset page shows its form only then). */
export async function checkPasswordResetToken(token: string): Promise<{ valid: boolean }> {
  if (!token) return { valid: false };
  const rec = await findPasswordResetByTokenHash(db(), hashSecret(token));
  return { valid: Boolean(rec && !rec.usedAt && rec.expiresAt.getTime() > Date.now()) };
}

/** Set a new password from a reset link; uses up every open link of the account. */
export async function resetPassword(input: ResetPasswordInput): Promise<{ email: string }> {
  const passwordHash = await hashPassword(input.password);
  return db().transaction(async (trx) => {
    const rec = await findPasswordResetByTokenHash(trx, hashSecret(input.token));
    if (!rec || rec.usedAt || rec.expiresAt.getTime() <= Date.now()) {
      throw new AppError("not_found", "This reset link is invalid, already used or expired. Ask for a new one.");
    }
    const user = await findUserById(trx, rec.userId);
    if (!user || user.disabled) throw new AppError("not_found", "This reset link is invalid. Ask for a new one.");
    await updateUserPassword(trx, user.id, passwordHash);
    await markPasswordResetsUsed(trx, user.id);
    for (const m of await listMembershipsForUser(trx, user.id)) {
      await recordAudit(trx, { organisationId: m.organisationId, userId: user.id }, {
        action: "user.password_reset", subjectType: "user", subjectId: user.id,
      });
    }
    return { email: user.email };
  });
}
