"use client";

import * as LabelPrimitive from "@radix-ui/react-label";
import type { ComponentProps } from "react";
import { cn } from "./cn";

export type LabelProps = ComponentProps<typeof LabelPrimitive.Root>;

/** A control's label (double-clicking it does not select its text). */
export function Label({ className, ...props }: LabelProps) {
  return (
    <LabelPrimitive.Root className={cn("text-sm font-semibold text-ink", className)} {...props} />
  );
}
