/**
 * Every step of reading a file costs time in proportion to its size, whatever its shape.
 * Speed itself is measured by the benchmark; these checks only catch a step that grows faster
 * than the file (a header search that re-reads the text at every line break took 28 s for
 * 200 000 blank lines). Bounds are loose on purpose: a quadratic step misses them by far.
 */
import { describe, expect, it } from "vitest";
import { analyseCsv } from "@/lib/import/analyse";
import { parseCsv } from "@/lib/import/csv";
import { context } from "./import-fixtures";

const header = "athlete,test,trial,value\n";
const shapes: [string, (n: number) => string][] = [
  ["blank lines before the header", (n) => `${"\n".repeat(n)}${header}NHA001,Countermovement jump,1,41\n`],
  ["CRLF blank lines", (n) => `${"\r\n".repeat(n / 2)}${header}NHA001,Countermovement jump,1,41\n`],
  ["one line of delimiters", (n) => ",".repeat(n)],
  ["blank rows of delimiters after the header", (n) => `${header}${",,,\n".repeat(n / 4)}`],
  ["one quoted field of doubled quotes", (n) => `${header}NHA001,"${'""'.repeat(n / 2)}",1,2\n`],
  ["an unclosed quote", (n) => `${header}NHA001,"${"x\n".repeat(n / 2)}`],
  ["misplaced quotes on every line", (n) => `${header}${'"x"y,"a"b,1,2\n'.repeat(n / 14)}`],
  ["one long number", (n) => `${header}NHA001,Countermovement jump,1,${"1".repeat(n)}#\n`],
  ["ordinary rows", (n) => `${header}${"NHA001,Countermovement jump,1,41.2\n".repeat(n / 35)}`],
];

function fastest(run: () => unknown, times = 3) {
  let best = Infinity;
  for (let k = 0; k < times; k++) {
    const start = performance.now();
    run();
    best = Math.min(best, performance.now() - start);
  }
  return best;
}

describe("reading a file is linear in its size", () => {
  it("200 000 blank lines before the header take well under 5 s (they took 28 s)", () => {
    const start = performance.now();
    const table = parseCsv(`${"\n".repeat(200_000)}${header}NHA001,Countermovement jump,1,41\n`);
    expect(performance.now() - start).toBeLessThan(5000);
    expect(table.headerRow).toBe(200_001);
    expect(table.rowNumbers).toEqual([200_002]);
  });

  for (const [shape, make] of shapes) {
    it(`${shape}: four times the size takes less than eight times as long`, () => {
      const n = 1 << 19;
      const small = make(n);
      const large = make(4 * n);
      // Linear work grows 4×, quadratic 16×: a threshold of 8 sits far from both. A busy
      // machine can still slow one run, so the best of three attempts counts (a quadratic step
      // fails every attempt). The floor keeps timer noise on tiny runs out of it.
      let ratio = Infinity;
      for (let attempt = 0; attempt < 3 && ratio >= 8; attempt++) {
        const t1 = fastest(() => analyseCsv(small, {}, context));
        const t4 = fastest(() => analyseCsv(large, {}, context));
        ratio = Math.min(ratio, t4 / Math.max(t1, 10));
      }
      expect(ratio).toBeLessThan(8);
    });
  }
});
