"use client";

import Link from "next/link";
import { useMemo, useState } from "react";
import { type Column, PhoneFacts, TableCard, WIDE_ONLY } from "@/components/table-card";
import type { RosterAthlete } from "@/lib/client/queries";
import { formatDate } from "@/lib/labels";

type SortKey = "name" | "position" | "sex" | "dateOfBirth" | "externalId";
const COLUMNS: { key: SortKey; label: string }[] = [
  { key: "name", label: "Name" },
  { key: "position", label: "Position / event" },
  { key: "sex", label: "Sex" },
  { key: "dateOfBirth", label: "Date of birth" },
  { key: "externalId", label: "External id" },
];
const SEX_LABELS: Record<string, string> = { female: "Female", male: "Male", other: "Other" };

function compare(a: string | null, b: string | null) {
  return (a ?? "").localeCompare(b ?? "", "en", { numeric: true, sensitivity: "base" });
}

export function AthleteTable({
  athletes,
  renderActions,
}: {
  athletes: RosterAthlete[];
  renderActions: (athlete: RosterAthlete) => React.ReactNode;
}) {
  const [query, setQuery] = useState("");
  const [sort, setSort] = useState<{ key: SortKey; dir: 1 | -1 }>({ key: "name", dir: 1 });

  // Missing values sort last in either direction, so gaps never hide the top of the list.
  const shown = useMemo(() => {
    const q = query.trim().toLowerCase();
    const filtered = q
      ? athletes.filter((a) =>
          [a.name, ...a.aliases, a.position, a.externalId, a.sex ? SEX_LABELS[a.sex] : null, a.dateOfBirth].some((v) =>
            v?.toLowerCase().includes(q),
          ),
        )
      : athletes;
    return [...filtered].sort((a, b) => {
      const av = a[sort.key];
      const bv = b[sort.key];
      if (!av !== !bv) return av ? -1 : 1;
      return compare(av, bv) * sort.dir || compare(a.name, b.name);
    });
  }, [athletes, query, sort]);

  const columns: Column[] = [
    ...COLUMNS.map((col): Column => {
      const active = sort.key === col.key;
      return {
        // On a phone only the name keeps its column; the rest stack under it.
        className: col.key === "name" ? undefined : WIDE_ONLY,
        "aria-sort": active ? (sort.dir === 1 ? "ascending" : "descending") : "none",
        label: (
          <button
            type="button"
            className="flex items-center gap-1 font-semibold uppercase tracking-wide hover:text-ink"
            onClick={() => setSort(active ? { key: col.key, dir: sort.dir === 1 ? -1 : 1 } : { key: col.key, dir: 1 })}
          >
            {col.label}
            <span aria-hidden className={active ? "text-ink" : "opacity-30"}>
              {active && sort.dir === -1 ? "▼" : "▲"}
            </span>
          </button>
        ),
      };
    }),
    { label: "Actions", srOnly: true, className: WIDE_ONLY },
  ];

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-center gap-3">
        <label htmlFor="roster-filter" className="sr-only">
          Filter athletes
        </label>
        <input
          id="roster-filter"
          type="search"
          className="field max-w-xs"
          placeholder="Filter by name, position, id…"
          value={query}
          onChange={(e) => setQuery(e.target.value)}
        />
        <span className="text-sm text-ink-soft" aria-live="polite">
          <span className="num">{shown.length}</span> of <span className="num">{athletes.length}</span> athletes
        </span>
      </div>
      <TableCard columns={columns}>
        {shown.length === 0 && (
          <tr>
            <td colSpan={columns.length} className="px-3 py-6 text-center text-ink-soft">
              {athletes.length === 0 ? "No athletes in this squad yet." : "No athlete matches the filter."}
            </td>
          </tr>
        )}
        {shown.map((a) => {
          const cells = {
            position: a.position ?? "–",
            sex: a.sex ? SEX_LABELS[a.sex] : "–",
            dateOfBirth: (
              <span className="num whitespace-nowrap">{a.dateOfBirth ? formatDate(a.dateOfBirth) : "–"}</span>
            ),
            externalId: <span className="num">{a.externalId ?? "–"}</span>,
          };
          const actions = renderActions(a);
          return (
            <tr
              key={a.id}
              className={`border-b border-line last:border-0 ${a.archived ? "bg-paper text-ink-soft" : ""}`}
            >
              <td className="px-3 py-2">
                <Link
                  href={`/athletes/${a.id}`}
                  className="font-semibold underline-offset-2 hover:underline"
                  title={`Athlete history of ${a.name}`}
                >
                  {a.name}
                </Link>
                {a.archived && (
                  <span className="ml-2 rounded bg-steady-soft px-1.5 py-0.5 text-xs text-ink-soft">Archived</span>
                )}
                {a.aliases.length > 0 && (
                  <span className="block text-xs text-ink-soft">In files also: {a.aliases.join(", ")}</span>
                )}
                <PhoneFacts
                  facts={COLUMNS.filter((col) => col.key !== "name").map((col) => ({
                    label: col.label,
                    value: cells[col.key as Exclude<SortKey, "name">],
                  }))}
                  actions={actions}
                />
              </td>
              <td className={`px-3 py-2 ${WIDE_ONLY}`}>{cells.position}</td>
              <td className={`px-3 py-2 ${WIDE_ONLY}`}>{cells.sex}</td>
              <td className={`px-3 py-2 ${WIDE_ONLY}`}>{cells.dateOfBirth}</td>
              <td className={`px-3 py-2 ${WIDE_ONLY}`}>{cells.externalId}</td>
              <td className={`px-3 py-2 ${WIDE_ONLY}`}>{actions}</td>
            </tr>
          );
        })}
      </TableCard>
    </div>
  );
}
