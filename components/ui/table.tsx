import Link from "next/link";
import type { ComponentProps, MouseEventHandler, ReactNode } from "react";
import { cn } from "./cn";

export type TableProps = ComponentProps<"table"> & {
  /**
   * Names the scrolling region around a wide table, which then takes keyboard focus so it can
   * be scrolled without a mouse. Leave out for narrow tables.
   */
  label?: string;
  /** compact for desks (default), comfortable for touch. */
  density?: "compact" | "comfortable";
  wrapperClassName?: string;
};

/** A data table: tabular figures, header row on the sunken surface, thin row rules. */
export function Table({
  label,
  density = "compact",
  className,
  wrapperClassName,
  ...props
}: TableProps) {
  return (
    <div
      className={cn(
        "w-full overflow-x-auto rounded-lg border border-line bg-surface-raised",
        wrapperClassName,
      )}
      role={label ? "region" : undefined}
      aria-label={label}
      tabIndex={label ? 0 : undefined}
    >
      <table
        data-density={density}
        className={cn(
          "group/table w-full border-collapse text-left text-sm text-ink tabular-nums",
          className,
        )}
        {...props}
      />
    </div>
  );
}

export function TableCaption({ className, ...props }: ComponentProps<"caption">) {
  return (
    <caption
      className={cn("px-3 py-2 text-left text-sm text-muted caption-top", className)}
      {...props}
    />
  );
}

export function THead({ className, ...props }: ComponentProps<"thead">) {
  return <thead className={cn("bg-surface-sunken", className)} {...props} />;
}

export function TBody({ className, ...props }: ComponentProps<"tbody">) {
  return <tbody className={cn("[&>tr:last-child]:border-b-0", className)} {...props} />;
}

export function TFoot({ className, ...props }: ComponentProps<"tfoot">) {
  return (
    <tfoot
      className={cn("border-t-2 border-line-strong bg-surface-sunken font-semibold", className)}
      {...props}
    />
  );
}

export type TrProps = ComponentProps<"tr"> & { selected?: boolean };

export function Tr({ selected = false, className, ...props }: TrProps) {
  return (
    <tr
      aria-selected={selected || undefined}
      className={cn(
        "border-b border-line hover:bg-sand-50",
        selected && "bg-accent-soft hover:bg-accent-soft",
        className,
      )}
      {...props}
    />
  );
}

export type SortDirection = "ascending" | "descending" | "none";

export type ThProps = ComponentProps<"th"> & {
  /** Right-align (the header of a number column). */
  numeric?: boolean;
  /** Makes the column sortable; the current direction, or "none" when another column sorts. */
  sort?: SortDirection;
  /** Where the sort link goes (server-rendered sorting). */
  sortHref?: string;
  /** Or a handler (client-side sorting); used when there is no sortHref. */
  onSort?: MouseEventHandler<HTMLButtonElement>;
};

function SortIndicator({ sort }: { sort: SortDirection }) {
  return (
    <svg
      viewBox="0 0 12 16"
      aria-hidden="true"
      focusable="false"
      className="h-4 w-3 shrink-0"
      data-sort={sort}
    >
      <path d="M6 2 10 7H2Z" fill="currentColor" opacity={sort === "ascending" ? 1 : 0.3} />
      <path d="M6 14 2 9h8Z" fill="currentColor" opacity={sort === "descending" ? 1 : 0.3} />
    </svg>
  );
}

const cellPad = "px-3 py-2 group-data-[density=comfortable]/table:py-3";

/**
 * A header cell. aria-sort is set only on the column the table is sorted by, as ARIA asks;
 * the triangles show the same to sighted users.
 */
export function Th({
  numeric = false,
  sort,
  sortHref,
  onSort,
  scope,
  className,
  children,
  ...props
}: ThProps) {
  const sortable = sort !== undefined;
  const content: ReactNode = sortable ? (
    <>
      <span>{children}</span>
      <SortIndicator sort={sort} />
    </>
  ) : (
    children
  );
  const controlClass = cn(
    "-mx-1 inline-flex min-h-6 items-center gap-1 rounded px-1 font-semibold hover:text-accent",
    numeric && "flex-row-reverse",
  );
  return (
    <th
      scope={scope ?? "col"}
      aria-sort={sort === "ascending" || sort === "descending" ? sort : undefined}
      className={cn(
        cellPad,
        // Column headers: small capitals in muted ink; row headers read like the row's name.
        scope === "row"
          ? "align-top text-sm font-semibold text-ink"
          : "align-bottom text-xs font-semibold tracking-wide text-muted uppercase",
        numeric ? "text-right" : "text-left",
        className,
      )}
      {...props}
    >
      {sortable && sortHref !== undefined ? (
        <Link href={sortHref} className={controlClass} scroll={false}>
          {content}
        </Link>
      ) : sortable && onSort ? (
        <button type="button" onClick={onSort} className={controlClass}>
          {content}
        </button>
      ) : sortable ? (
        <span className={controlClass}>{content}</span>
      ) : (
        content
      )}
    </th>
  );
}

export type TdProps = ComponentProps<"td"> & {
  /** A number: right-aligned, tabular figures, no wrapping. */
  numeric?: boolean;
  /** The unit written after the value (prefer <Quantity> inside for formatting). */
  unit?: string;
};

export function Td({ numeric = false, unit, className, children, ...props }: TdProps) {
  return (
    <td
      className={cn(
        cellPad,
        "align-top",
        numeric && "text-right whitespace-nowrap tabular-nums",
        className,
      )}
      {...props}
    >
      {children}
      {unit && <span className="text-muted">{`\u00a0${unit}`}</span>}
    </td>
  );
}
