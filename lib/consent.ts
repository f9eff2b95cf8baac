/**
 * Consent to show an athlete their results (PRODUCT.md §8): the athlete's own, recorded by the
 * club, and for a minor a parent's or guardian's too. One rule for My progress, the publish
 * dialog and the results mail, so what staff are told is what athletes get.
 */

/** Under this age on the day in question, a guardian's consent is needed as well. */
export const ADULT_AGE = 18;

export type ConsentFields = {
  dateOfBirth: string | null;
  consentRecordedOn: string | null;
  guardianConsentOn: string | null;
};

export type ConsentMissing = "athlete" | "guardian";

export type ConsentCheck = {
  ok: boolean;
  /** A minor on the day checked (from the date of birth; unknown dates of birth count as adult). */
  minor: boolean;
  missing: ConsentMissing[];
};

/** Whole years from `dateOfBirth` to `onDate`, both YYYY-MM-DD, without time zones. */
export function ageOn(dateOfBirth: string, onDate: string): number {
  const [by, bm, bd] = dateOfBirth.split("-").map(Number);
  const [y, m, d] = onDate.split("-").map(Number);
  const hadBirthday = m > bm || (m === bm && d >= bd);
  return y - by - (hadBirthday ? 0 : 1);
}

/** Today as YYYY-MM-DD (UTC, like every stored date). */
export const todayIso = (now = new Date()) => now.toISOString().slice(0, 10);

/**
 * What consent is missing on `onDate`. A club that has not recorded a date of birth has not
 * recorded a minor either: the athlete's own consent then suffices (the Roster form asks for both).
 */
export function checkConsent(athlete: ConsentFields, onDate: string): ConsentCheck {
  const minor = athlete.dateOfBirth !== null && ageOn(athlete.dateOfBirth, onDate) < ADULT_AGE;
  const missing: ConsentMissing[] = [];
  if (!athlete.consentRecordedOn) missing.push("athlete");
  if (minor && !athlete.guardianConsentOn) missing.push("guardian");
  return { ok: missing.length === 0, minor, missing };
}
