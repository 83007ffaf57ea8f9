import { useId, type ComponentProps, type ReactNode } from "react";
import { cn } from "./cn";

export type CheckboxProps = Omit<ComponentProps<"input">, "type" | "size"> & {
  /** Always present: what ticking the box means. */
  label: ReactNode;
  hint?: ReactNode;
  size?: "md" | "lg";
};

/**
 * A native checkbox with its label beside it. The label row is at least 44 px tall and
 * toggles the box, so it works with a thumb or a glove.
 */
export function Checkbox({
  label,
  hint,
  size = "md",
  id,
  className,
  disabled,
  ...props
}: CheckboxProps) {
  const autoId = useId();
  const inputId = id ?? `cb${autoId}`;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const describedBy = [props["aria-describedby"], hintId].filter(Boolean).join(" ") || undefined;
  return (
    <div className={cn("flex items-start gap-3", className)}>
      <input
        id={inputId}
        type="checkbox"
        disabled={disabled}
        className={cn(
          "mt-3 shrink-0 cursor-pointer accent-accent disabled:cursor-not-allowed",
          size === "lg" ? "size-6" : "size-5",
        )}
        {...props}
        aria-describedby={describedBy}
      />
      <div className="flex flex-col">
        <label
          htmlFor={inputId}
          className={cn(
            "flex cursor-pointer items-center font-medium text-ink",
            size === "lg" ? "min-h-12 text-base" : "min-h-11 text-sm",
            disabled && "cursor-not-allowed text-muted",
          )}
        >
          {label}
        </label>
        {hint && (
          <p id={hintId} className="-mt-2 pb-1 text-sm text-muted">
            {hint}
          </p>
        )}
      </div>
    </div>
  );
}
