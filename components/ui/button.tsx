import { Slot, Slottable } from "@radix-ui/react-slot";
import type { ComponentProps } from "react";
import { cn } from "./cn";
import { Spinner } from "./spinner";

export type ButtonVariant = "primary" | "secondary" | "danger" | "ghost" | "link";
export type ButtonSize = "sm" | "md" | "lg";

const base =
  "inline-flex shrink-0 items-center justify-center gap-2 rounded-md font-semibold whitespace-nowrap select-none " +
  "transition-colors disabled:cursor-not-allowed disabled:opacity-60 aria-disabled:cursor-not-allowed aria-disabled:opacity-60";

const variantClass: Record<ButtonVariant, string> = {
  primary: "bg-accent text-on-accent hover:bg-accent-hover",
  secondary: "border border-line-strong bg-surface-raised text-ink hover:bg-surface-sunken",
  danger: "bg-danger text-on-danger hover:bg-danger-hover",
  ghost: "text-ink hover:bg-surface-sunken",
  link: "text-accent underline decoration-2 underline-offset-4 hover:text-accent-hover",
};

// lg is the field size: at least 48 px tall and wide, comfortable with gloves.
const sizeClass: Record<ButtonSize, string> = {
  sm: "h-8 px-3 text-sm",
  md: "h-10 px-4 text-sm",
  lg: "min-h-12 min-w-12 px-5 text-base",
};

/** The button look as classes, for elements that cannot be a Button (rare; prefer asChild). */
export function buttonClasses({
  variant = "primary",
  size = "md",
  className,
}: { variant?: ButtonVariant; size?: ButtonSize; className?: string } = {}): string {
  // A link-styled button keeps the height (a usable target) but drops the side padding.
  return cn(base, variantClass[variant], sizeClass[size], variant === "link" && "px-0", className);
}

export type ButtonProps = ComponentProps<"button"> & {
  variant?: ButtonVariant;
  size?: ButtonSize;
  /** Render the single child (e.g. a Link) with the button's look and behaviour. */
  asChild?: boolean;
  /** Shows a spinner, sets aria-busy and stops further presses until the work is done. */
  loading?: boolean;
};

export function Button({
  variant = "primary",
  size = "md",
  asChild = false,
  loading = false,
  disabled,
  className,
  children,
  ...props
}: ButtonProps) {
  const classes = buttonClasses({ variant, size, className });
  const spinner = loading ? <Spinner size={size === "lg" ? "md" : "sm"} /> : null;

  if (asChild) {
    // A slotted link cannot be disabled natively, so say so with aria-disabled.
    return (
      <Slot
        className={classes}
        aria-busy={loading || undefined}
        aria-disabled={disabled || loading || undefined}
        data-loading={loading || undefined}
        {...props}
      >
        {spinner}
        <Slottable>{children}</Slottable>
      </Slot>
    );
  }

  return (
    <button
      className={classes}
      disabled={disabled || loading}
      aria-busy={loading || undefined}
      data-loading={loading || undefined}
      {...props}
    >
      {spinner}
      {children}
    </button>
  );
}
