import type { TestItem } from "@/lib/client/queries";

const num = (value: number) => String(Number(value.toPrecision(6)));

/** The SWC method in words, e.g. "0.2 × between-athlete SD", "Fixed 0.5 cm", "0.3 × CV% (CV 1.2 %)". */
export function swcWords(test: Pick<TestItem, "swcMethod" | "swcValue" | "cvPercent" | "unit">): string {
  switch (test.swcMethod) {
    case "sd-factor":
      return `${num(test.swcValue)} × between-athlete SD`;
    case "fixed":
      return `Fixed ${num(test.swcValue)} ${test.unit}`;
    case "cv-factor":
      return `${num(test.swcValue)} × CV%${test.cvPercent !== null ? ` (CV ${num(test.cvPercent)} %)` : ""}`;
  }
}

export function rangeWords(test: Pick<TestItem, "plausibleMin" | "plausibleMax" | "unit">): string | null {
  const { plausibleMin: min, plausibleMax: max, unit } = test;
  if (min !== null && max !== null) return `${num(min)}–${num(max)} ${unit}`;
  if (min !== null) return `at least ${num(min)} ${unit}`;
  if (max !== null) return `at most ${num(max)} ${unit}`;
  return null;
}

export function directionWords(direction: TestItem["direction"]): { arrow: string; words: string } {
  return direction === "higher" ? { arrow: "↑", words: "Higher is better" } : { arrow: "↓", words: "Lower is better" };
}

export function typicalErrorWords(test: Pick<TestItem, "typicalError" | "typicalErrorDf" | "unit">): string | null {
  if (test.typicalError === null) return null;
  const df = test.typicalErrorDf !== null ? ` (df ${test.typicalErrorDf})` : " (df not given)";
  return `${num(test.typicalError)} ${test.unit}${df}`;
}
