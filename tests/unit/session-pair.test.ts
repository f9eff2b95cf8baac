import { describe, expect, it } from "vitest";
import { keptTest, pairSquad, sharedTestIds, squadSessions } from "@/lib/reports/session-pair";

// Invented sessions of two squads.
const sessions = [
  { id: 4, squadId: 1, date: "2026-09-14", testIds: [1, 2, 3] },
  { id: 9, squadId: 1, date: "2026-11-09", testIds: [3, 2] },
  { id: 7, squadId: 1, date: "2026-09-14", testIds: [2] },
  { id: 5, squadId: 2, date: "2026-09-07", testIds: [1] },
];

describe("session pairs", () => {
  it("offers the squad's sessions oldest first, the same day in the order they were made", () => {
    expect(squadSessions(sessions, 1).map((s) => s.id)).toEqual([4, 7, 9]);
    expect(pairSquad(sessions, 99, 5, 1)).toBe(2);
    expect(pairSquad(sessions, 99, 98, 1)).toBe(1);
  });

  it("keeps the test when both sessions measured it, else the first they share, else the old one", () => {
    expect(sharedTestIds(sessions, 4, 9)).toEqual([2, 3]);
    expect(keptTest(sessions, 4, 9, 3)).toBe(3);
    expect(keptTest(sessions, 4, 7, 3)).toBe(2);
    expect(keptTest(sessions, 4, 5, 2)).toBe(1);
    expect(keptTest(sessions, 7, 5, 2)).toBe(2);
  });
});
