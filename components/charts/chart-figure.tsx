import { useId, type ReactNode } from "react";

/**
 * A chart with its title, a sentence saying what it shows, and the same numbers as a table
 * (collapsed under the chart; screen readers and keyboard users get the table, the drawing is a
 * picture of it).
 */
export function ChartFigure({
  title,
  description,
  table,
  children,
  testId,
}: {
  title: string;
  description: ReactNode;
  table: ReactNode;
  children: ReactNode;
  testId?: string;
}) {
  const id = useId();
  return (
    <figure className="flex flex-col gap-3" aria-labelledby={`${id}-t`} aria-describedby={`${id}-d`} data-testid={testId}>
      <div>
        <h3 id={`${id}-t`} className="text-base font-semibold text-ink">
          {title}
        </h3>
        <p id={`${id}-d`} className="text-sm text-muted">
          {description}
        </p>
      </div>
      {children}
      <details className="group rounded-md border border-line bg-surface-raised">
        <summary className="flex min-h-10 cursor-pointer items-center px-3 text-sm font-semibold text-accent">Show these numbers as a table</summary>
        <div className="px-2 pb-2">{table}</div>
      </details>
    </figure>
  );
}
