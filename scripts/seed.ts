import { resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { count } from "drizzle-orm";
import { hashPassword } from "@/lib/auth/password";
import { reduceTrials } from "@/lib/trials";
import { type Database, databaseUrl, openDatabase } from "../db/connection";
import { migrateDatabase } from "../db/migrate";
import * as s from "../db/schema";
import {
  ACADEMY_SQUAD,
  DEMO_ORG,
  DEMO_PASSWORD,
  DEMO_TESTS,
  type DemoTest,
  OTHER_ORG,
  OTHER_SQUAD,
  roundTo,
  SENIOR_SQUAD,
  seededRandom,
} from "./demo-data";

/** Athletes who sign in, by name: both run in Senior Women. */
const ATHLETE_ACCOUNTS: Record<string, string> = {
  "Tessa Lindqvist": "athlete@example.com",
  "Priya Damaschke": "athlete2@example.com",
};

/** The day the club recorded consents (invented). */
const CONSENT_DAY = "2026-08-20";

/**
 * Consent exceptions, so the publish dialog shows both cases in Senior Women: an adult whose
 * consent is not recorded, and a 17-year-old (born 2009, in the senior squad) whose guardian's
 * consent is not recorded. Everyone else has consent; minors have their guardian's as well.
 */
const CONSENT_GAPS: Record<string, { dateOfBirth?: string; consent: boolean; guardian: boolean }> = {
  "Noor Balfour": { consent: false, guardian: false },
  "Clío Nakashima": { dateOfBirth: "2009-05-12", consent: true, guardian: false },
};

type SessionPlan = {
  squad: "senior" | "academy";
  date: string;
  phase: s.Phase;
  status: s.SessionStatus;
  tests: string[];
  notes?: string;
};

const SESSIONS: SessionPlan[] = [
  {
    squad: "senior",
    date: "2026-08-24",
    phase: "baseline",
    status: "draft",
    tests: ["cmj", "sprint10"],
    notes: "Test–retest day 1: familiarised, same warm-up, same gates.",
  },
  {
    squad: "senior",
    date: "2026-08-27",
    phase: "retest",
    status: "draft",
    tests: ["cmj", "sprint10"],
    notes: "Test–retest day 2: no training between the two days.",
  },
  {
    squad: "senior",
    date: "2026-09-07",
    phase: "pre-block",
    status: "published",
    tests: ["cmj", "sprint10", "sprint30", "ir1", "squat"],
  },
  {
    squad: "senior",
    date: "2026-11-02",
    phase: "post-block",
    status: "draft",
    tests: ["cmj", "sprint10", "sprint30", "ir1", "squat"],
    notes: "End of the 8-week power block.",
  },
  {
    squad: "academy",
    date: "2026-09-14",
    phase: "pre-block",
    status: "published",
    tests: ["cmj", "sprint10", "sprint30", "ir1", "squat"],
  },
  {
    squad: "academy",
    date: "2026-11-09",
    phase: "post-block",
    status: "draft",
    tests: ["cmj", "sprint10", "sprint30", "ir1", "squat"],
  },
];

async function insertChunks<T>(items: T[], size: number, write: (chunk: T[]) => Promise<unknown>) {
  for (let i = 0; i < items.length; i += size) await write(items.slice(i, i + size));
}

export async function isSeeded(db: Database) {
  const [row] = await db.select({ n: count() }).from(s.organizations);
  return (row?.n ?? 0) > 0;
}

/** Seeds the invented demo club and a second, separate organisation. */
export async function seedDemo(db: Database, { passwordCost }: { passwordCost?: number } = {}) {
  const random = seededRandom(20260901);
  const passwordHash = await hashPassword(DEMO_PASSWORD, passwordCost);

  const [club] = await db.insert(s.organizations).values({ name: DEMO_ORG }).returning({ id: s.organizations.id });
  const [other] = await db.insert(s.organizations).values({ name: OTHER_ORG }).returning({ id: s.organizations.id });

  const people = await db
    .insert(s.users)
    .values([
      { email: "owner@example.com", name: "Rhiannon Cole", passwordHash },
      { email: "scientist@example.com", name: "Dr Tomás Everly", passwordHash },
      { email: "coach@example.com", name: "Gus Adebayo", passwordHash },
      { email: "athlete@example.com", name: "Tessa Lindqvist", passwordHash },
      { email: "owner@other.example.com", name: "Marguerite Hale", passwordHash },
      // A second coach and a second athlete account, so reach is visible between peers too:
      // a coach of one squad beside a coach of the other, an athlete beside a squad-mate.
      { email: "coach2@example.com", name: "Ilse Marchetti", passwordHash },
      { email: "athlete2@example.com", name: "Priya Damaschke", passwordHash },
    ])
    .returning({ id: s.users.id, email: s.users.email });
  const userId = (email: string) => people.find((p) => p.email === email)!.id;

  await db.insert(s.memberships).values([
    { userId: userId("owner@example.com"), organizationId: club.id, role: "owner" },
    { userId: userId("scientist@example.com"), organizationId: club.id, role: "scientist" },
    { userId: userId("coach@example.com"), organizationId: club.id, role: "coach" },
    { userId: userId("athlete@example.com"), organizationId: club.id, role: "athlete" },
    { userId: userId("owner@other.example.com"), organizationId: other.id, role: "owner" },
    { userId: userId("coach2@example.com"), organizationId: club.id, role: "coach" },
    { userId: userId("athlete2@example.com"), organizationId: club.id, role: "athlete" },
  ]);

  const [senior, academy] = await db
    .insert(s.squads)
    .values([
      { organizationId: club.id, name: SENIOR_SQUAD.name, sport: SENIOR_SQUAD.sport },
      { organizationId: club.id, name: ACADEMY_SQUAD.name, sport: ACADEMY_SQUAD.sport },
    ])
    .returning({ id: s.squads.id });
  await db.insert(s.squadCoaches).values([
    { squadId: academy.id, userId: userId("coach@example.com") },
    { squadId: senior.id, userId: userId("coach2@example.com") },
  ]);

  async function addAthletes(
    squadId: number,
    organizationId: number,
    names: string[],
    positions: string[],
    prefix: string,
    sex: "female" | "male",
    birthYear: number,
  ) {
    const rows = await db
      .insert(s.athletes)
      .values(
        names.map((name, i) => ({
          organizationId,
          name,
          sex,
          position: positions[i] ?? null,
          externalId: `${prefix}${String(i + 1).padStart(3, "0")}`,
          dateOfBirth:
            CONSENT_GAPS[name]?.dateOfBirth ??
            `${birthYear + (i % 4)}-${String((i % 12) + 1).padStart(2, "0")}-${String(((i * 7) % 27) + 1).padStart(2, "0")}`,
          userId: ATHLETE_ACCOUNTS[name] ? userId(ATHLETE_ACCOUNTS[name]) : null,
          consentRecordedOn: (CONSENT_GAPS[name]?.consent ?? true) ? CONSENT_DAY : null,
          // Recorded for every athlete born 2008 or later, the ones under 18 at some point of the season.
          guardianConsentOn: birthYear >= 2008 && (CONSENT_GAPS[name]?.guardian ?? true) ? CONSENT_DAY : null,
        })),
      )
      .returning({ id: s.athletes.id });
    await db.insert(s.squadAthletes).values(rows.map((r) => ({ squadId, athleteId: r.id })));
    return rows.map((r) => r.id);
  }
  const seniorIds = await addAthletes(
    senior.id,
    club.id,
    SENIOR_SQUAD.athletes,
    SENIOR_SQUAD.positions,
    "NHW",
    "female",
    1994,
  );
  const academyIds = await addAthletes(
    academy.id,
    club.id,
    ACADEMY_SQUAD.athletes,
    ACADEMY_SQUAD.positions,
    "NHA",
    "male",
    2008,
  );

  const testRows = await db
    .insert(s.tests)
    .values(
      DEMO_TESTS.map((t) => ({
        organizationId: club.id,
        name: t.name,
        unit: t.unit,
        decimals: t.decimals,
        direction: t.direction,
        trialRule: t.trialRule,
        trialsPerSession: t.trials,
        plausibleMin: t.plausible[0],
        plausibleMax: t.plausible[1],
        typicalError: t.typicalError?.value ?? null,
        typicalErrorDf: t.typicalError?.df ?? null,
        typicalErrorSource: t.typicalError?.source ?? null,
        aliases: t.aliases ?? [],
      })),
    )
    .returning({ id: s.tests.id });
  const testByKey = new Map(DEMO_TESTS.map((t, i) => [t.key, { ...t, id: testRows[i].id }]));

  // True ability per athlete × test at baseline, and each athlete's own response to the block.
  const ability = new Map<string, { base: number; response: number }>();
  for (const id of [...seniorIds, ...academyIds]) {
    for (const t of DEMO_TESTS) {
      const scale = academyIds.includes(id) ? 0.97 : 1;
      ability.set(`${id}:${t.key}`, {
        base: t.mean * scale + random.normal() * t.sd,
        response: t.blockChange + random.normal() * t.blockChangeSd,
      });
    }
  }

  const trialsFor = (t: DemoTest, trueScore: number) =>
    Array.from({ length: t.trials }, () => roundTo(trueScore * (1 + random.normal() * t.cv), t.decimals));

  const scientist = userId("scientist@example.com");
  for (const plan of SESSIONS) {
    const squadId = plan.squad === "senior" ? senior.id : academy.id;
    const roster = plan.squad === "senior" ? seniorIds : academyIds;
    const [session] = await db
      .insert(s.testingSessions)
      .values({
        organizationId: club.id,
        squadId,
        date: plan.date,
        phase: plan.phase,
        status: plan.status,
        notes: plan.notes ?? null,
        createdBy: scientist,
        publishedAt: plan.status === "published" ? new Date(`${plan.date}T18:00:00Z`) : null,
      })
      .returning({ id: s.testingSessions.id });
    await db
      .insert(s.sessionTests)
      .values(plan.tests.map((key, position) => ({ sessionId: session.id, testId: testByKey.get(key)!.id, position })));

    const afterBlock = plan.phase === "post-block";
    const rows: (typeof s.results.$inferInsert)[] = [];
    roster.forEach((athleteId, index) => {
      // Real squads have gaps: two seniors and one academy player miss the post-block day.
      if (afterBlock && (index === 4 || index === 11) && plan.squad === "senior") return;
      if (afterBlock && index === 7 && plan.squad === "academy") return;
      for (const key of plan.tests) {
        const t = testByKey.get(key)!;
        const a = ability.get(`${athleteId}:${key}`)!;
        if (plan.phase === "pre-block" && index === 9 && key === "squat") {
          rows.push({
            organizationId: club.id,
            sessionId: session.id,
            athleteId,
            testId: t.id,
            trials: [],
            value: null,
            flag: "injured",
            note: "Sore lower back; skipped the lift.",
            updatedBy: scientist,
          });
          continue;
        }
        const trials = trialsFor(t, a.base + (afterBlock ? a.response : 0));
        rows.push({
          organizationId: club.id,
          sessionId: session.id,
          athleteId,
          testId: t.id,
          trials,
          value: reduceTrials(trials, t.trialRule, t.direction),
          updatedBy: scientist,
        });
      }
    });
    await insertChunks(rows, 200, (chunk) => db.insert(s.results).values(chunk));
  }

  // The second organisation: its own squad, athletes, test and session, never visible to the club.
  const [rowing] = await db
    .insert(s.squads)
    .values({ organizationId: other.id, name: OTHER_SQUAD.name, sport: OTHER_SQUAD.sport })
    .returning({ id: s.squads.id });
  const rowers = await addAthletes(rowing.id, other.id, OTHER_SQUAD.athletes, [], "KBR", "female", 2007);
  const [erg] = await db
    .insert(s.tests)
    .values({
      organizationId: other.id,
      name: "2000 m ergometer",
      unit: "s",
      decimals: 1,
      direction: "lower",
      trialRule: "best",
      trialsPerSession: 1,
      plausibleMin: 360,
      plausibleMax: 600,
    })
    .returning({ id: s.tests.id });
  const [ergSession] = await db
    .insert(s.testingSessions)
    .values({
      organizationId: other.id,
      squadId: rowing.id,
      date: "2026-10-05",
      phase: "baseline",
      status: "published",
      createdBy: userId("owner@other.example.com"),
    })
    .returning({ id: s.testingSessions.id });
  await db.insert(s.sessionTests).values({ sessionId: ergSession.id, testId: erg.id, position: 0 });
  await db.insert(s.results).values(
    rowers.map((athleteId) => {
      const value = roundTo(455 + random.normal() * 18, 1);
      return { organizationId: other.id, sessionId: ergSession.id, athleteId, testId: erg.id, trials: [value], value };
    }),
  );
}

const invokedDirectly = process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  (async () => {
    const url = databaseUrl();
    await migrateDatabase(url);
    const { client, db } = openDatabase(url, process.env.DATABASE_AUTH_TOKEN);
    try {
      if (await isSeeded(db)) {
        console.log("Database already holds data; the demo seed was skipped.");
        return;
      }
      await seedDemo(db);
      console.log("Demo club seeded.");
    } finally {
      client.close();
    }
  })().catch((error) => {
    console.error("Seeding failed:", error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
