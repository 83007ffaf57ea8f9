import type { ComponentProps, ReactNode } from "react";
import { cn } from "./cn";

export type PageHeaderProps = Omit<ComponentProps<"header">, "title"> & {
  title: ReactNode;
  /** The one question this page answers, in plain words ("Which vehicles can go out today?"). */
  question?: ReactNode;
  /** The action that follows from the answer, right beside it. */
  actions?: ReactNode;
  /** A short line above the title: a breadcrumb or the record's kind. */
  eyebrow?: ReactNode;
};

/** The top of every page: title, the question it answers, and what to do next. */
export function PageHeader({
  title,
  question,
  actions,
  eyebrow,
  className,
  ...props
}: PageHeaderProps) {
  return (
    <header
      className={cn(
        "flex flex-wrap items-end justify-between gap-x-6 gap-y-3 border-b border-line pb-4",
        className,
      )}
      {...props}
    >
      <div className="min-w-0 max-w-3xl">
        {eyebrow && <div className="mb-1 text-sm font-medium text-muted">{eyebrow}</div>}
        <h1 className="text-2xl font-bold tracking-tight text-balance text-ink">{title}</h1>
        {question && <p className="mt-1 text-base text-muted">{question}</p>}
      </div>
      {actions && <div className="flex flex-wrap items-center gap-2">{actions}</div>}
    </header>
  );
}
