/**
 * The role rules of PRODUCT.md §2 as one table: each rule, each role, the expected answer.
 * A change of rule shows up here as a changed row, not as a scattered edit.
 */
import { describe, expect, it } from "vitest";
import {
  canEditRoster,
  canEditSession,
  canEditTestLibrary,
  canManageSquad,
  canPublish,
  canRunReliability,
  isAthlete,
  isCoach,
  isManager,
  isOwner,
  isStaff,
  MANAGERS,
  OWNERS,
  STAFF,
} from "@/lib/auth/permissions";
import { ROLES, type Role } from "@/lib/domain";

type Rule = (who: { role: Role }) => boolean;

//                                   owner  scientist coach  athlete
const TABLE: [string, Rule, [boolean, boolean, boolean, boolean]][] = [
  ["isOwner", isOwner, [true, false, false, false]],
  ["isManager", isManager, [true, true, false, false]],
  ["isCoach", isCoach, [false, false, true, false]],
  ["isAthlete", isAthlete, [false, false, false, true]],
  ["isStaff", isStaff, [true, true, true, false]],
  ["canEditSession (draft)", (who) => canEditSession(who, "draft"), [true, true, true, false]],
  ["canEditSession (published)", (who) => canEditSession(who, "published"), [true, true, false, false]],
  ["canPublish", canPublish, [true, true, false, false]],
  ["canManageSquad", canManageSquad, [true, false, false, false]],
  ["canEditRoster", canEditRoster, [true, true, true, false]],
  ["canEditTestLibrary", canEditTestLibrary, [true, true, false, false]],
  ["canRunReliability", canRunReliability, [true, true, false, false]],
];

describe("permissions", () => {
  it("lists the roles in the order the table's columns use", () => {
    expect(ROLES).toEqual(["owner", "scientist", "coach", "athlete"]);
  });

  for (const [name, rule, expected] of TABLE) {
    it(`${name}: ${ROLES.map((role, i) => `${role} ${expected[i] ? "yes" : "no"}`).join(", ")}`, () => {
      expect(ROLES.map((role) => rule({ role }))).toEqual(expected);
    });
  }

  it("the role lists guard takes agree with the rules the screens ask", () => {
    expect(STAFF).toEqual(["owner", "scientist", "coach"]);
    expect(MANAGERS).toEqual(["owner", "scientist"]);
    expect(OWNERS).toEqual(["owner"]);
    for (const role of ROLES) {
      // Routes guard these changes with these lists; the payloads' can* flags use the rules.
      expect(MANAGERS.includes(role)).toBe(canPublish({ role }));
      expect(MANAGERS.includes(role)).toBe(canEditTestLibrary({ role }));
      expect(OWNERS.includes(role)).toBe(canManageSquad({ role }));
      expect(STAFF.includes(role)).toBe(canEditRoster({ role }));
    }
  });
});
