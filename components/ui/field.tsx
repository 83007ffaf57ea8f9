import {
  Children,
  cloneElement,
  isValidElement,
  useId,
  type ReactElement,
  type ReactNode,
} from "react";
import { cn } from "./cn";
import { Label } from "./label";
import { StatusShape } from "./status-shape";

/** What Field hands to its control so label, hint and error are wired up. */
export type FieldControlProps = {
  id: string;
  "aria-describedby"?: string;
  "aria-invalid"?: true;
  required?: boolean;
};

export type FieldProps = {
  label: ReactNode;
  /** Short help shown under the label and read with the control. */
  hint?: ReactNode;
  /** The error for this control; sets aria-invalid and is read with the control. */
  error?: ReactNode;
  required?: boolean;
  /** The control's id; one is made up when absent. */
  id?: string;
  className?: string;
  /**
   * One control element (Input, Select, Textarea, …) — Field adds id, aria-describedby,
   * aria-invalid and required to it — or a function that receives those props.
   */
  children: ReactElement<Partial<FieldControlProps>> | ((control: FieldControlProps) => ReactNode);
};

/** The ids Field gives the hint and error of a control with the given id. */
export function fieldIds(id: string): { hintId: string; errorId: string } {
  return { hintId: `${id}-hint`, errorId: `${id}-error` };
}

function joinIds(...ids: (string | undefined)[]): string | undefined {
  const joined = ids.filter((x): x is string => Boolean(x)).join(" ");
  return joined === "" ? undefined : joined;
}

/** Label, hint, control and error, in that order, with the accessibility wiring done. */
export function Field({
  label,
  hint,
  error,
  required = false,
  id,
  className,
  children,
}: FieldProps) {
  const autoId = useId();
  const controlId = id ?? `f${autoId}`;
  const { hintId, errorId } = fieldIds(controlId);
  const hasHint = hint !== undefined && hint !== null && hint !== false;
  const hasError = error !== undefined && error !== null && error !== false && error !== "";

  let control: ReactNode;
  if (typeof children === "function") {
    control = children({
      id: controlId,
      "aria-describedby": joinIds(hasHint ? hintId : undefined, hasError ? errorId : undefined),
      "aria-invalid": hasError ? true : undefined,
      required: required || undefined,
    });
  } else {
    const child = Children.only(children);
    if (!isValidElement<Partial<FieldControlProps>>(child))
      throw new Error("Field needs one control element");
    control = cloneElement(child, {
      id: controlId,
      "aria-describedby": joinIds(
        child.props["aria-describedby"],
        hasHint ? hintId : undefined,
        hasError ? errorId : undefined,
      ),
      "aria-invalid": hasError ? true : child.props["aria-invalid"],
      required: required || child.props.required,
    });
  }

  return (
    <div className={cn("grid gap-1.5", className)} data-invalid={hasError || undefined}>
      <Label htmlFor={controlId}>
        {label}
        {required && (
          <span aria-hidden="true" className="ml-0.5 text-danger">
            *
          </span>
        )}
      </Label>
      {hasHint && (
        <p id={hintId} className="-mt-1 text-sm text-muted">
          {hint}
        </p>
      )}
      {control}
      {hasError && (
        <p id={errorId} className="flex items-start gap-1.5 text-sm font-semibold text-danger">
          <StatusShape tone="danger" sizePx={12} className="mt-1" />
          <span>{error}</span>
        </p>
      )}
    </div>
  );
}
