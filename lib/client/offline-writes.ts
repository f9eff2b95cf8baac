/**
 * Sheet writes kept in the browser (IndexedDB, through idb) while the network is down: they
 * survive closing the tab and are sent in the order they were typed once the connection is
 * back — each with the version it was typed against, so a change someone else made meanwhile
 * still shows as a conflict instead of being overwritten.
 */
import { type DBSchema, type IDBPDatabase, openDB } from "idb";
import type { ResultFlag } from "@/lib/domain";

export type OfflineWrite = {
  /** Order of typing; assigned by the store. */
  seq?: number;
  sessionId: number;
  /** The account that typed it: on a shared tablet, only that account sends it. */
  userId: number;
  athleteId: number;
  testId: number;
  trials: (number | null)[];
  flag: ResultFlag | null;
  note: string | null;
  /** The version of the result when the first of these offline edits was typed (null: no result yet). */
  version: number | null;
  typedAt: number;
};

interface OfflineDb extends DBSchema {
  writes: { key: number; value: OfflineWrite; indexes: { bySession: number } };
}

const NAME = "changewise-offline";
let opening: Promise<IDBPDatabase<OfflineDb>> | null = null;

function db() {
  opening ??= openDB<OfflineDb>(NAME, 1, {
    upgrade(database) {
      const store = database.createObjectStore("writes", { keyPath: "seq", autoIncrement: true });
      store.createIndex("bySession", "sessionId");
    },
  });
  return opening;
}

/** The session's writes waiting from one account, oldest first. */
export async function waitingWrites(sessionId: number, userId: number): Promise<OfflineWrite[]> {
  const all = await (await db()).getAllFromIndex("writes", "bySession", sessionId);
  return all.filter((w) => w.userId === userId).sort((a, b) => (a.seq ?? 0) - (b.seq ?? 0));
}

/**
 * Keeps a write until it can be sent. A later edit of the same result replaces the earlier one
 * but keeps its version: the server never saw the earlier edit, so the later one is typed
 * against the same stored result.
 */
export async function keepWrite(write: OfflineWrite): Promise<void> {
  const database = await db();
  const tx = database.transaction("writes", "readwrite");
  const earlier = (await tx.store.index("bySession").getAll(write.sessionId)).find(
    (w) => w.userId === write.userId && w.athleteId === write.athleteId && w.testId === write.testId,
  );
  if (earlier) await tx.store.put({ ...write, seq: earlier.seq, version: earlier.version });
  else {
    const { seq: _unsaved, ...fresh } = write;
    await tx.store.add(fresh);
  }
  await tx.done;
}

/** Forgets a write once the server has answered it (saved, or a conflict now shown on the sheet). */
export async function forgetWrite(seq: number): Promise<void> {
  await (await db()).delete("writes", seq);
}
