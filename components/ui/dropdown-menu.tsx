"use client";

import * as MenuPrimitive from "@radix-ui/react-dropdown-menu";
import type { ComponentProps } from "react";
import { cn } from "./cn";

/**
 * A menu of actions opened from a button (arrow keys move, Escape or Tab closes). Not modal by
 * default: the rest of the page is not hidden from assistive tech while it is open.
 */
export function DropdownMenu({
  modal = false,
  ...props
}: ComponentProps<typeof MenuPrimitive.Root>) {
  return <MenuPrimitive.Root modal={modal} {...props} />;
}
export const DropdownMenuTrigger = MenuPrimitive.Trigger;
export const DropdownMenuGroup = MenuPrimitive.Group;

export function DropdownMenuContent({
  className,
  sideOffset = 6,
  align = "start",
  ...props
}: ComponentProps<typeof MenuPrimitive.Content>) {
  return (
    <MenuPrimitive.Portal>
      <MenuPrimitive.Content
        sideOffset={sideOffset}
        align={align}
        className={cn(
          "z-50 max-h-[var(--radix-dropdown-menu-content-available-height)] min-w-48 overflow-y-auto rounded-md border border-line bg-surface-raised p-1 text-ink shadow-lg",
          className,
        )}
        {...props}
      />
    </MenuPrimitive.Portal>
  );
}

export type DropdownMenuItemProps = ComponentProps<typeof MenuPrimitive.Item> & {
  tone?: "default" | "danger";
};

export function DropdownMenuItem({ className, tone = "default", ...props }: DropdownMenuItemProps) {
  return (
    <MenuPrimitive.Item
      className={cn(
        "flex min-h-10 cursor-default items-center gap-2 rounded px-3 text-sm font-medium select-none outline-none",
        "data-[highlighted]:bg-accent-soft data-[highlighted]:text-accent-ink data-[disabled]:pointer-events-none data-[disabled]:text-muted data-[disabled]:opacity-60",
        "data-[highlighted]:ring-3 data-[highlighted]:ring-focus data-[highlighted]:ring-inset",
        tone === "danger" &&
          "text-danger data-[highlighted]:bg-danger-soft data-[highlighted]:text-danger-ink",
        className,
      )}
      {...props}
    />
  );
}

export function DropdownMenuLabel({
  className,
  ...props
}: ComponentProps<typeof MenuPrimitive.Label>) {
  return (
    <MenuPrimitive.Label
      className={cn(
        "px-3 pt-2 pb-1 text-xs font-semibold tracking-wide text-muted uppercase",
        className,
      )}
      {...props}
    />
  );
}

export function DropdownMenuSeparator({
  className,
  ...props
}: ComponentProps<typeof MenuPrimitive.Separator>) {
  return <MenuPrimitive.Separator className={cn("my-1 h-px bg-line", className)} {...props} />;
}
