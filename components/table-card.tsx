import type { ReactNode, ThHTMLAttributes } from "react";

/** A column heading; any other `<th>` attribute (title, aria-sort…) is passed on. */
export type Column = {
  label: ReactNode;
  align?: "right";
  /** Heard by screen readers, not shown (e.g. an actions column). */
  srOnly?: boolean;
} & Omit<ThHTMLAttributes<HTMLTableCellElement>, "align" | "children">;

/**
 * A card holding a dense table: small column headings over the rows given as children.
 * `headCellClass` carries the padding (and weight) of the heading cells, as the rows below use it.
 * `asWritten` keeps headings in their own case: the import preview shows a file's headers, and
 * capitals would misquote them.
 */
export function TableCard({
  columns,
  headCellClass = "px-3 py-2",
  asWritten = false,
  caption,
  children,
}: {
  columns: Column[];
  headCellClass?: string;
  asWritten?: boolean;
  caption?: ReactNode;
  children: ReactNode;
}) {
  return (
    <div className="card relative overflow-x-auto">
      <table className="w-full text-left text-sm">
        {caption && <caption className="px-4 pt-3 text-left text-sm text-ink-soft">{caption}</caption>}
        <thead className={`border-b border-line text-xs text-ink-faint${asWritten ? "" : " uppercase tracking-wide"}`}>
          <tr>
            {columns.map(({ label, align, srOnly, className, ...th }, i) => (
              <th
                // biome-ignore lint/suspicious/noArrayIndexKey: headings are fixed columns, in order
                key={i}
                scope="col"
                {...th}
                className={[headCellClass, align === "right" && "text-right", className].filter(Boolean).join(" ")}
              >
                {srOnly ? <span className="sr-only">{label}</span> : label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>{children}</tbody>
      </table>
    </div>
  );
}
