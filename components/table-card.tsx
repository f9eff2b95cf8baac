import { Fragment, type ReactNode, type ThHTMLAttributes } from "react";

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

/**
 * Cells that leave the row below the `sm` breakpoint: on a phone their content is shown by
 * `PhoneFacts` inside the row's first cell instead, so the table never scrolls sideways.
 */
export const WIDE_ONLY = "hidden sm:table-cell";

export type Fact = { label: string; value: ReactNode };

/**
 * Below `sm`, a row's key figures as small lines under its name, and its actions as buttons that
 * wrap. Give it the same nodes the wide cells show, so a row's content is written once.
 */
export function PhoneFacts({ facts, actions }: { facts: Fact[]; actions?: ReactNode }) {
  return (
    <div className="mt-1 space-y-2 sm:hidden">
      {facts.length > 0 && (
        <dl className="grid grid-cols-[auto_1fr] gap-x-3 gap-y-0.5 text-xs">
          {facts.map((fact) => (
            <Fragment key={fact.label}>
              <dt className="text-ink-soft">{fact.label}</dt>
              <dd className="min-w-0 [overflow-wrap:anywhere]">{fact.value}</dd>
            </Fragment>
          ))}
        </dl>
      )}
      {actions}
    </div>
  );
}
