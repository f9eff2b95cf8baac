/**
 * The one error type `lib/stats` throws for bad input.
 *
 * Messages are written for a coach, not a programmer: they name the problem in
 * the coach's terms ("pre and post scores") and, where it helps, the numbers
 * that were received. Callers can show `message` as is.
 *
 * @example
 * try { pairedChange([1, 2], [3]); }
 * catch (e) { if (e instanceof StatsInputError) console.log(e.message); }
 * // "Pre and post need the same number of scores (got 2 and 1)."
 */
export class StatsInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "StatsInputError";
    // Keeps `instanceof` reliable when the class is down-levelled or bundled twice.
    Object.setPrototypeOf(this, new.target.prototype);
  }
}
