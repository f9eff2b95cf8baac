import type { SheetTest } from "@/lib/client/queries";

/** Every focusable column of the sheet, left to right: each test's trial slots, then its flag. */
export type NavColumn =
  | { kind: "trial"; test: SheetTest; index: number; trialCol: number }
  | { kind: "flag"; test: SheetTest };

export function sheetColumns(tests: SheetTest[]) {
  const nav: NavColumn[] = [];
  let trialCol = 0;
  for (const test of tests) {
    for (let index = 0; index < test.trialsPerSession; index++)
      nav.push({ kind: "trial", test, index, trialCol: trialCol++ });
    nav.push({ kind: "flag", test });
  }
  const trials = nav.filter((c): c is Extract<NavColumn, { kind: "trial" }> => c.kind === "trial");
  const navIndex = new Map<string, number>();
  nav.forEach((c, i) => {
    navIndex.set(c.kind === "trial" ? `${c.test.id}:${c.index}` : `${c.test.id}:flag`, i);
  });
  return { nav, trials, navIndex };
}

/** A block copied from a spreadsheet: rows by newline, cells by tab. A trailing newline is not a row. */
export function parseBlock(text: string): string[][] {
  const rows = text.replace(/\r\n?/g, "\n").replace(/\n+$/, "").split("\n");
  return rows.map((row) => row.split("\t"));
}

export const isBlock = (text: string) => /[\t\n\r]/.test(text.replace(/[\r\n]+$/, ""));
