import type { Db } from "@/lib/db/knex";
import { withDbErrors } from "@/lib/db/pg-errors";

export async function insertSignInAttempt(db: Db, a: { email: string; ip: string; succeeded: boolean }): Promise<void> {
  await withDbErrors(() => db("sign_in_attempts").insert({ email: a.email, ip: a.ip, succeeded: a.succeeded }));
}

/**
 * Failed attempts since `since` for an e-mail and for an address, each counted only after
 * the latest success of that key (a successful sign-in resets the e-mail's count).
 */
export async function countRecentFailures(
  db: Db,
  key: { email: string; ip: string },
  since: Date,
): Promise<{ byEmail: number; byIp: number }> {
  const count = async (col: "email" | "ip", value: string) => {
    const row = await withDbErrors(() =>
      db("sign_in_attempts as s")
        .count<{ n: string }[]>({ n: "*" })
        .where(`s.${col}`, value)
        .andWhere("s.succeeded", false)
        .andWhere("s.at", ">", since)
        .andWhereRaw(
          `s.at > coalesce((select max(t.at) from sign_in_attempts t where t.${col} = ? and t.succeeded), '-infinity')`,
          [value],
        )
        .first(),
    );
    return Number(row?.n ?? 0);
  };
  const [byEmail, byIp] = await Promise.all([count("email", key.email), count("ip", key.ip)]);
  return { byEmail, byIp };
}

/** Delete attempts older than `before` (housekeeping; keeps the table small). */
export async function pruneSignInAttempts(db: Db, before: Date): Promise<number> {
  return withDbErrors(() => db("sign_in_attempts").where("at", "<", before).del());
}
