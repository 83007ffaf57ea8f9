import Link from "next/link";
import { InputError } from "@/lib/errors";
import { cn } from "./cn";

/** One slot in the pager: a page number or a gap ("…"). */
export type PageItem = number | "gap";

/**
 * Which page numbers to show: always the first and last, the current one with `siblings`
 * either side, and a gap where pages are skipped (a gap never stands for a single page, that
 * page is shown instead). `page` is clamped into 1…pageCount.
 */
export function pageItems(page: number, pageCount: number, siblings = 1): PageItem[] {
  if (!Number.isFinite(page)) throw new InputError("page", "page must be a finite number");
  if (!Number.isFinite(pageCount))
    throw new InputError("pageCount", "pageCount must be a finite number");
  if (!Number.isInteger(siblings) || siblings < 0)
    throw new InputError("siblings", "siblings must be a whole number ≥ 0");
  const count = Math.max(0, Math.trunc(pageCount));
  if (count === 0) return [];
  const current = Math.min(count, Math.max(1, Math.trunc(page)));
  const shown = new Set<number>([1, count]);
  for (let p = current - siblings; p <= current + siblings; p++)
    if (p >= 1 && p <= count) shown.add(p);
  const sorted = [...shown].sort((a, b) => a - b);
  const items: PageItem[] = [];
  let previous = 0;
  for (const p of sorted) {
    if (p - previous === 2) items.push(p - 1);
    else if (p - previous > 2) items.push("gap");
    items.push(p);
    previous = p;
  }
  return items;
}

export type PaginationProps = {
  page: number;
  pageCount: number;
  hrefFor: (page: number) => string;
  /** Names the navigation landmark. */
  label?: string;
  className?: string;
};

const itemClass =
  "inline-flex h-10 min-w-10 items-center justify-center rounded-md px-3 text-sm font-semibold tabular-nums";

/** Page links; renders nothing when there is only one page. */
export function Pagination({
  page,
  pageCount,
  hrefFor,
  label = "Pages",
  className,
}: PaginationProps) {
  const items = pageItems(page, pageCount);
  const count = Math.max(0, Math.trunc(pageCount));
  if (count <= 1) return null;
  const current = Math.min(count, Math.max(1, Math.trunc(page)));

  const step = (target: number, word: string, enabled: boolean) =>
    enabled ? (
      <Link
        href={hrefFor(target)}
        rel={word === "Next" ? "next" : "prev"}
        className={cn(itemClass, "text-accent hover:bg-surface-sunken")}
      >
        {word}
      </Link>
    ) : (
      <span aria-disabled="true" className={cn(itemClass, "text-muted opacity-60")}>
        {word}
      </span>
    );

  return (
    <nav aria-label={label} className={cn("flex", className)}>
      <ul className="flex flex-wrap items-center gap-1">
        <li>{step(current - 1, "Previous", current > 1)}</li>
        {items.map((item, i) =>
          item === "gap" ? (
            <li key={`gap-${i}`} aria-hidden="true" className={cn(itemClass, "px-1 text-muted")}>
              …
            </li>
          ) : (
            <li key={item}>
              {item === current ? (
                <Link
                  href={hrefFor(item)}
                  aria-current="page"
                  className={cn(itemClass, "bg-accent text-on-accent")}
                >
                  <span className="sr-only">Page </span>
                  {item}
                </Link>
              ) : (
                <Link
                  href={hrefFor(item)}
                  className={cn(itemClass, "text-ink hover:bg-surface-sunken")}
                >
                  <span className="sr-only">Page </span>
                  {item}
                </Link>
              )}
            </li>
          ),
        )}
        <li>{step(current + 1, "Next", current < count)}</li>
      </ul>
    </nav>
  );
}
