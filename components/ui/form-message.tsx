import type { ReactNode } from "react";
import { cn } from "./cn";
import { StatusShape } from "./status-shape";

export type FormMessageTone = "error" | "success" | "info";

const toneClass: Record<FormMessageTone, string> = {
  error: "border-danger bg-danger-soft text-danger-ink",
  success: "border-ok bg-ok-soft text-ok-ink",
  info: "border-info bg-info-soft text-info-ink",
};

const toneShape = { error: "danger", success: "ok", info: "info" } as const;

const defaultLabel: Record<FormMessageTone, string> = {
  error: "Form error",
  success: "Form result",
  info: "Form note",
};

export type FormMessageProps = {
  tone?: FormMessageTone;
  /** The message; when empty the (invisible) region stays in place so later text is announced. */
  children?: ReactNode;
  /**
   * The region's accessible name. Named so tests and assistive tech can tell it apart from
   * other live regions on the page (Next's route announcer among them).
   */
  label?: string;
  "data-testid"?: string;
  className?: string;
  id?: string;
};

/** A polite live region for a form's overall error or success. */
export function FormMessage({
  tone = "error",
  children,
  label,
  className,
  id,
  "data-testid": testId,
}: FormMessageProps) {
  const empty =
    children === undefined || children === null || children === false || children === "";
  return (
    <div
      id={id}
      role="status"
      aria-live="polite"
      aria-atomic="true"
      aria-label={label ?? defaultLabel[tone]}
      data-testid={testId}
      data-tone={tone}
      className={cn(
        !empty && "flex items-start gap-2 rounded-md border-l-4 px-3 py-2.5 text-sm font-medium",
        !empty && toneClass[tone],
        className,
      )}
    >
      {!empty && (
        <>
          <StatusShape tone={toneShape[tone]} sizePx={14} className="mt-0.5" />
          <div>{children}</div>
        </>
      )}
    </div>
  );
}
