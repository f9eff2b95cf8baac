import Link from "next/link";

export type Crumb = { href?: string; label: string };

/** Where a screen sits: links back up the trail; the last step, without a link, is the screen itself. */
export function Breadcrumbs({ trail }: { trail: Crumb[] }) {
  return (
    <nav aria-label="Breadcrumb" className="text-sm text-ink-soft">
      <ol className="flex flex-wrap items-center gap-1">
        {trail.map((crumb, i) => (
          // biome-ignore lint/suspicious/noArrayIndexKey: a trail may name a page twice; its place in the trail is what tells the two apart
          <li key={`${crumb.label}-${i}`} className="flex items-center gap-1">
            {i > 0 && <span aria-hidden>›</span>}
            {crumb.href ? (
              <Link href={crumb.href} className="hover:underline">
                {crumb.label}
              </Link>
            ) : (
              <span aria-current="page">{crumb.label}</span>
            )}
          </li>
        ))}
      </ol>
    </nav>
  );
}
