/**
 * Who may see what in the seeded demo, computed from the database rather than restated, and a
 * leak finder: every name, external id or record id in an answer that the caller may not see.
 */
import type { Client } from "@libsql/client";

export type World = {
  orgs: { id: number; name: string }[];
  users: { id: number; name: string; email: string; org: number; role: string; athleteId: number | null }[];
  squads: { id: number; name: string; org: number; coachIds: number[] }[];
  athletes: { id: number; name: string; externalId: string | null; org: number; squadIds: number[] }[];
  sessions: { id: number; org: number; squadId: number; status: string }[];
  tests: { id: number; name: string; org: number }[];
};

const rowsOf = async (client: Client, sql: string) =>
  (await client.execute(sql)).rows as unknown as Record<string, unknown>[];
const ids = (csv: unknown) => (csv ? String(csv).split(",").map(Number) : []);

export async function loadWorld(client: Client): Promise<World> {
  return {
    orgs: (await rowsOf(client, "SELECT id, name FROM organizations")).map((r) => ({
      id: Number(r.id),
      name: String(r.name),
    })),
    users: (
      await rowsOf(
        client,
        `SELECT u.id, u.name, u.email, m.organization_id AS org, m.role, a.id AS athlete_id
         FROM users u JOIN memberships m ON m.user_id = u.id LEFT JOIN athletes a ON a.user_id = u.id`,
      )
    ).map((r) => ({
      id: Number(r.id),
      name: String(r.name),
      email: String(r.email),
      org: Number(r.org),
      role: String(r.role),
      athleteId: r.athlete_id === null ? null : Number(r.athlete_id),
    })),
    squads: (
      await rowsOf(
        client,
        "SELECT s.id, s.name, s.organization_id AS org, (SELECT group_concat(user_id) FROM squad_coaches c WHERE c.squad_id = s.id) AS coaches FROM squads s",
      )
    ).map((r) => ({ id: Number(r.id), name: String(r.name), org: Number(r.org), coachIds: ids(r.coaches) })),
    athletes: (
      await rowsOf(
        client,
        "SELECT a.id, a.name, a.external_id, a.organization_id AS org, (SELECT group_concat(squad_id) FROM squad_athletes x WHERE x.athlete_id = a.id) AS squads FROM athletes a",
      )
    ).map((r) => ({
      id: Number(r.id),
      name: String(r.name),
      externalId: r.external_id === null ? null : String(r.external_id),
      org: Number(r.org),
      squadIds: ids(r.squads),
    })),
    sessions: (await rowsOf(client, "SELECT id, organization_id AS org, squad_id, status FROM testing_sessions")).map(
      (r) => ({ id: Number(r.id), org: Number(r.org), squadId: Number(r.squad_id), status: String(r.status) }),
    ),
    tests: (await rowsOf(client, "SELECT id, name, organization_id AS org FROM tests")).map((r) => ({
      id: Number(r.id),
      name: String(r.name),
      org: Number(r.org),
    })),
  };
}

type Entity = "athlete" | "squad" | "session" | "test";
export type Visibility = { strings: string[]; ids: Record<Entity, Set<number>> };

/**
 * What `email` may NOT see: names and external ids of athletes out of reach, names of squads out
 * of reach, everything of another organisation (its name, people, tests), and the record ids.
 * The anonymous caller (null) may see nothing at all.
 */
export function forbiddenFor(world: World, email: string | null): Visibility {
  const user = email === null ? undefined : world.users.find((u) => u.email === email);
  const org = user?.org ?? -1;
  const role = user?.role ?? "none";
  const manager = role === "owner" || role === "scientist";
  const squadOk = (s: World["squads"][number]) =>
    s.org === org &&
    (manager ||
      (role === "coach" && s.coachIds.includes(user!.id)) ||
      (role === "athlete" && world.athletes.some((a) => a.id === user!.athleteId && a.squadIds.includes(s.id))));
  const visibleSquads = new Set(world.squads.filter(squadOk).map((s) => s.id));
  const athleteOk = (a: World["athletes"][number]) =>
    a.org === org &&
    (manager ||
      (role === "coach" && a.squadIds.some((id) => visibleSquads.has(id))) ||
      (role === "athlete" && a.id === user!.athleteId));
  const sessionOk = (s: World["sessions"][number]) =>
    s.org === org && visibleSquads.has(s.squadId) && (role !== "athlete" || s.status === "published");

  const strings = [
    ...world.orgs.filter((o) => o.id !== org).map((o) => o.name),
    ...world.users.filter((u) => u.org !== org).flatMap((u) => [u.name, u.email]),
    ...world.tests.filter((t) => t.org !== org).map((t) => t.name),
    ...world.squads.filter((s) => !squadOk(s)).map((s) => s.name),
    ...world.athletes.filter((a) => !athleteOk(a)).flatMap((a) => [a.name, ...(a.externalId ? [a.externalId] : [])]),
  ];
  // Names the caller may see under another hat: athletes in reach, and the staff of their own
  // organisation (who appear as the authors of changes). An athlete's account is not staff.
  const allowedStrings = new Set([
    ...world.athletes.filter(athleteOk).map((a) => a.name),
    ...world.users.filter((u) => u.org === org && u.role !== "athlete").map((u) => u.name),
  ]);
  return {
    strings: [...new Set(strings)].filter((s) => !allowedStrings.has(s)),
    ids: {
      athlete: new Set(world.athletes.filter((a) => !athleteOk(a)).map((a) => a.id)),
      squad: new Set(world.squads.filter((s) => !squadOk(s)).map((s) => s.id)),
      session: new Set(world.sessions.filter((s) => !sessionOk(s)).map((s) => s.id)),
      test: new Set(world.tests.filter((t) => t.org !== org).map((t) => t.id)),
    },
  };
}

const ID_KEYS: Record<string, Entity> = {
  athleteId: "athlete",
  athleteIds: "athlete",
  squadId: "squad",
  squadIds: "squad",
  sessionId: "session",
  testId: "test",
  testIds: "test",
};
const CONTAINERS: Record<string, Entity> = {
  athlete: "athlete",
  athletes: "athlete",
  squad: "squad",
  squads: "squad",
  session: "session",
  sessions: "session",
  test: "test",
  tests: "test",
};

/** Every (entity, id) an answer names, by key: `athleteId`, or `id` inside `athletes: [...]`. */
export function idsIn(value: unknown, context?: Entity, found: [Entity, number][] = []): [Entity, number][] {
  if (Array.isArray(value)) {
    for (const item of value) idsIn(item, context, found);
  } else if (value && typeof value === "object") {
    for (const [key, v] of Object.entries(value)) {
      const entity = ID_KEYS[key] ?? (key === "id" ? context : undefined);
      if (entity) for (const n of [v].flat()) if (typeof n === "number") found.push([entity, n]);
      idsIn(v, CONTAINERS[key] ?? (Array.isArray(v) ? context : undefined), found);
    }
  }
  return found;
}

/**
 * Things in `answer` the caller may not see. What the caller sent itself (ids, or a file's
 * contents echoed in an error message) is not news to it.
 */
export function leaksIn(answer: unknown, forbidden: Visibility, sentIds: Set<number>, sentText = ""): string[] {
  const text = typeof answer === "string" ? answer : (JSON.stringify(answer) ?? "");
  const leaks = forbidden.strings.filter((s) => text.includes(s) && !sentText.includes(s)).map((s) => `"${s}"`);
  for (const [entity, id] of idsIn(answer)) {
    if (forbidden.ids[entity].has(id) && !sentIds.has(id)) leaks.push(`${entity} #${id}`);
  }
  return [...new Set(leaks)];
}

/** Numbers a request carries in its path and body: the ids the caller already knows. */
export function numbersIn(...values: unknown[]): Set<number> {
  const out = new Set<number>();
  const visit = (v: unknown) => {
    if (typeof v === "number") out.add(v);
    else if (typeof v === "string" && /^\d+$/.test(v)) out.add(Number(v));
    else if (Array.isArray(v)) v.forEach(visit);
    else if (v && typeof v === "object" && !(v instanceof FormData)) Object.values(v).forEach(visit);
  };
  values.forEach(visit);
  return out;
}
