"use client";

import { Toaster as SonnerToaster, toast, type ToasterProps } from "sonner";
import { StatusShape } from "./status-shape";

export { toast };

/**
 * Where short notices ("Saved", "Sent to 3 firms") appear. Styled with our tokens; each kind
 * carries its status shape as well as its colour. Put it once in the root layout.
 */
export function Toaster({ style, ...props }: ToasterProps) {
  return (
    <SonnerToaster
      // Sonner sets its own font stack on the container; an inline style beats it.
      style={{ fontFamily: "var(--font-sans)", ...style }}
      position="bottom-right"
      closeButton
      containerAriaLabel="Notices"
      icons={{
        success: <StatusShape tone="ok" sizePx={16} />,
        error: <StatusShape tone="danger" sizePx={16} />,
        warning: <StatusShape tone="warn" sizePx={16} />,
        info: <StatusShape tone="info" sizePx={16} />,
      }}
      toastOptions={{
        unstyled: true,
        classNames: {
          toast:
            "group flex w-[var(--width)] items-start gap-3 rounded-lg border border-line border-l-4 bg-surface-raised px-4 py-3 text-sm text-ink shadow-lg",
          title: "font-semibold",
          description: "text-muted",
          icon: "mt-0.5",
          success: "border-l-ok",
          error: "border-l-danger",
          warning: "border-l-warn",
          info: "border-l-info",
          actionButton:
            "ml-auto rounded-md bg-accent px-3 py-1.5 text-sm font-semibold text-on-accent hover:bg-accent-hover",
          cancelButton:
            "rounded-md px-3 py-1.5 text-sm font-semibold text-ink hover:bg-surface-sunken",
          content: "grid flex-1 gap-0.5",
          // Unstyled toasts put the close button first in the row; move it to the end.
          closeButton:
            "order-last -my-1 -mr-2 inline-flex size-9 shrink-0 items-center justify-center rounded-md text-muted hover:bg-surface-sunken hover:text-ink",
        },
      }}
      {...props}
    />
  );
}
