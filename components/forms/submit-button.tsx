"use client";

import { useFormStatus } from "react-dom";
import { Button, type ButtonProps } from "@/components/ui";

/** A submit button that shows the form is working and cannot be pressed twice. */
export function SubmitButton({ children, ...props }: ButtonProps) {
  const { pending } = useFormStatus();
  return (
    <Button type="submit" loading={pending} disabled={pending || props.disabled} {...props}>
      {children}
    </Button>
  );
}
