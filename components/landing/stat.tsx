import Link from "next/link";
import type { ReactNode } from "react";

/** One figure on a home page, with what it means and where to act on it. */
export function Stat({ label, value, href, note }: { label: string; value: ReactNode; href?: string; note?: string }) {
  const body = (
    <>
      <span className="text-sm font-semibold text-muted">{label}</span>
      <span className="text-3xl font-bold tabular-nums">{value}</span>
      {note && <span className="text-sm text-muted">{note}</span>}
    </>
  );
  const cls = "flex flex-col gap-1 rounded-lg border border-line bg-surface-raised p-4";
  return href ? (
    <Link href={href} className={`${cls} hover:border-accent focus-visible:outline-3`}>
      {body}
    </Link>
  ) : (
    <div className={cls}>{body}</div>
  );
}
