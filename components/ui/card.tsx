import type { ComponentProps, ReactNode } from "react";
import { cn } from "./cn";

export type CardProps = ComponentProps<"section">;

/** A raised panel grouping one subject. */
export function Card({ className, ...props }: CardProps) {
  return (
    <section
      className={cn("rounded-lg border border-line bg-surface-raised shadow-xs", className)}
      {...props}
    />
  );
}

export type CardHeaderProps = Omit<ComponentProps<"div">, "title"> & {
  title: ReactNode;
  description?: ReactNode;
  /** Buttons or links for this card, placed at the end of the header. */
  actions?: ReactNode;
  /** Heading level of the title; h2 by default (under the page's h1). */
  as?: "h2" | "h3" | "h4";
};

export function CardHeader({
  title,
  description,
  actions,
  as: Heading = "h2",
  className,
  ...props
}: CardHeaderProps) {
  return (
    <div
      className={cn(
        "flex flex-wrap items-start justify-between gap-3 border-b border-line px-4 py-3",
        className,
      )}
      {...props}
    >
      <div className="min-w-0">
        <Heading className="text-base font-semibold text-ink">{title}</Heading>
        {description && <p className="mt-0.5 text-sm text-muted">{description}</p>}
      </div>
      {actions && <div className="flex shrink-0 flex-wrap items-center gap-2">{actions}</div>}
    </div>
  );
}

export function CardBody({ className, ...props }: ComponentProps<"div">) {
  return <div className={cn("px-4 py-4", className)} {...props} />;
}

export function CardFooter({ className, ...props }: ComponentProps<"div">) {
  return (
    <div
      className={cn(
        "flex flex-wrap items-center justify-end gap-2 rounded-b-lg border-t border-line bg-surface-sunken px-4 py-3",
        className,
      )}
      {...props}
    />
  );
}
