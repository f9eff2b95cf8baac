/**
 * An athlete's request to be deleted: one per athlete, kept until the owner acts on it (deleting
 * the athlete removes it too), and mailed to the organisation's owners.
 */
import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { getDb, writeTransaction } from "@/db/client";
import { athletes, deletionRequests, memberships, users } from "@/db/schema";
import { notFound } from "@/lib/errors";
import { appOrigin } from "@/lib/mail/config";
import type { DeletionRequestInput } from "@/lib/validation/people";
import type { Actor } from "./actors";
import { recordAudit } from "./audit";
import { queueMail } from "./mail";

const requestColumns = {
  id: deletionRequests.id,
  athleteId: deletionRequests.athleteId,
  athleteName: athletes.name,
  message: deletionRequests.message,
  requestedAt: deletionRequests.requestedAt,
};

const view = <R extends { requestedAt: Date }>(row: R) => ({ ...row, requestedAt: row.requestedAt.getTime() });

/**
 * Records the signed-in athlete's request and mails the owners. Asking again changes nothing and
 * answers with the request already on file (`created: false`).
 */
export async function requestDeletion(actor: Actor, input: DeletionRequestInput, now = new Date()) {
  const athleteId = actor.athleteId;
  if (athleteId === null) throw notFound("Athlete record");
  return writeTransaction(async (tx) => {
    const existing = await tx
      .select(requestColumns)
      .from(deletionRequests)
      .innerJoin(athletes, eq(athletes.id, deletionRequests.athleteId))
      .where(and(eq(deletionRequests.athleteId, athleteId), eq(deletionRequests.organizationId, actor.organizationId)));
    if (existing[0]) return { request: view(existing[0]), created: false };
    const [athlete] = await tx
      .select({ name: athletes.name })
      .from(athletes)
      .where(and(eq(athletes.id, athleteId), eq(athletes.organizationId, actor.organizationId)));
    if (!athlete) throw notFound("Athlete record");
    const [created] = await tx
      .insert(deletionRequests)
      .values({ organizationId: actor.organizationId, athleteId, message: input.message ?? null, requestedAt: now })
      .returning({ id: deletionRequests.id });
    const owners = await tx
      .select({ email: users.email })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.organizationId, actor.organizationId), eq(memberships.role, "owner")));
    for (const owner of owners)
      await queueMail(tx, {
        to: owner.email,
        organizationId: actor.organizationId,
        mail: {
          kind: "deletion-request",
          data: {
            athleteName: athlete.name,
            organizationName: actor.organizationName,
            message: input.message ?? null,
            link: `${appOrigin()}/people`,
          },
        },
      });
    // The message stays on the request itself; the trail records only that one was made.
    await recordAudit(tx, actor, { action: "athlete.deletion-request", entity: { type: "athlete", id: athleteId } });
    return {
      request: {
        id: created.id,
        athleteId,
        athleteName: athlete.name,
        message: input.message ?? null,
        requestedAt: now.getTime(),
      },
      created: true,
    };
  });
}

/** Requests waiting for the owner, oldest first. */
export async function listDeletionRequests(actor: Actor) {
  const rows = await getDb()
    .select(requestColumns)
    .from(deletionRequests)
    .innerJoin(athletes, eq(athletes.id, deletionRequests.athleteId))
    .where(eq(deletionRequests.organizationId, actor.organizationId))
    .orderBy(asc(deletionRequests.requestedAt));
  return rows.map(view);
}

export type DeletionRequestItem = Awaited<ReturnType<typeof listDeletionRequests>>[number];
