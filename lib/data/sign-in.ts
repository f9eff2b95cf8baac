import "server-only";
import { and, eq, gt, or, sql } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { signInAttempts, users } from "@/db/schema";

export async function findUserCredentials(email: string) {
  const [row] = await getDb()
    .select({ id: users.id, email: users.email, name: users.name, passwordHash: users.passwordHash })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  return row ?? null;
}

export async function countRecentFailures(email: string, address: string, since: number) {
  const [row] = await getDb()
    .select({
      byEmail: sql<number>`coalesce(sum(case when ${signInAttempts.email} = ${email} then 1 else 0 end), 0)`,
      byAddress: sql<number>`coalesce(sum(case when ${signInAttempts.address} = ${address} then 1 else 0 end), 0)`,
    })
    .from(signInAttempts)
    .where(
      and(
        gt(signInAttempts.attemptedAt, since),
        or(eq(signInAttempts.email, email), eq(signInAttempts.address, address)),
      ),
    );
  return { byEmail: Number(row?.byEmail ?? 0), byAddress: Number(row?.byAddress ?? 0) };
}

export async function recordFailure(email: string, address: string, at: number) {
  await writeTransaction((tx) => tx.insert(signInAttempts).values({ email, address, attemptedAt: at }));
}

export async function clearFailures(email: string) {
  await writeTransaction((tx) => tx.delete(signInAttempts).where(eq(signInAttempts.email, email)));
}
