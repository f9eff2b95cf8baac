import type { SheetTest } from "@/lib/client/queries";
import { plausibleWords } from "@/lib/sheet/model";

export function SheetHead({ tests }: { tests: SheetTest[] }) {
  return (
    <thead className="sticky top-0 z-20 bg-white text-left">
      <tr>
        <th
          rowSpan={2}
          scope="col"
          className="sticky left-0 z-30 min-w-32 border-b xl:min-w-44 border-line bg-white px-3 py-2 align-bottom text-xs uppercase tracking-wide text-ink-faint"
        >
          Athlete
        </th>
        {tests.map((t) => (
          <th
            key={t.id}
            scope="colgroup"
            colSpan={t.trialsPerSession + 2}
            className="border-l-2 border-line px-2 pt-2 align-top"
          >
            <span className="block whitespace-nowrap text-sm font-bold">{t.name}</span>
            <span className="block whitespace-nowrap text-xs font-normal text-ink-soft">
              {t.unit} · <span aria-hidden>{t.direction === "higher" ? "↑" : "↓"}</span>{" "}
              {t.direction === "higher" ? "Higher is better" : "Lower is better"}
              {t.plausibleMin !== null || t.plausibleMax !== null ? ` · plausible ${plausibleWords(t)}` : ""}
            </span>
          </th>
        ))}
      </tr>
      <tr className="text-xs uppercase tracking-wide text-ink-faint">
        {tests.map((t) => [
          ...Array.from({ length: t.trialsPerSession }, (_, i) => (
            <th
              // biome-ignore lint/suspicious/noArrayIndexKey: trial columns are numbered slots of the test
              key={`${t.id}-${i}`}
              scope="col"
              className={`border-b border-line px-1 pb-1 text-right font-semibold ${i === 0 ? "border-l-2 pl-2" : ""}`}
            >
              <span className="sr-only">Trial </span>
              {t.trialsPerSession === 1 ? "Score" : `T${i + 1}`}
            </th>
          )),
          <th key={`${t.id}-value`} scope="col" className="border-b border-line px-2 pb-1 text-right font-semibold">
            {t.trialRule === "best" ? "Best" : "Mean"}
          </th>,
          <th key={`${t.id}-flag`} scope="col" className="border-b border-line px-1 pb-1 font-semibold">
            Flag
          </th>,
        ])}
      </tr>
    </thead>
  );
}
