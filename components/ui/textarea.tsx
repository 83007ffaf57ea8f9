import type { ComponentProps } from "react";
import { cn } from "./cn";
import { controlClasses, type ControlSize } from "./control";

export type TextareaProps = ComponentProps<"textarea"> & { size?: ControlSize };

/** Multi-line text. Grows by hand (vertical resize only). */
export function Textarea({ size = "md", className, rows = 4, ...props }: TextareaProps) {
  return (
    <textarea
      rows={rows}
      className={controlClasses(size, cn("h-auto resize-y py-2", className))}
      {...props}
    />
  );
}
