// From the module itself, not the index: the browser needs the codes, not jStat.
import { VERDICTS, type Verdict } from "@/lib/stats/verdict";

/** Best first: the order lib/stats lists the verdicts in, for sorting a table by verdict. */
export const VERDICT_ORDER = Object.fromEntries(VERDICTS.map((v, i) => [v, i])) as Record<Verdict, number>;
