import type { ComponentProps } from "react";
import { controlClasses, type ControlSize } from "./control";

export type InputProps = Omit<ComponentProps<"input">, "size"> & {
  size?: ControlSize;
  /** The native `size` attribute (width in characters), renamed to free `size`. */
  htmlSize?: number;
};

/** A text-like input. Give it a label: wrap it in Field. */
export function Input({ size = "md", htmlSize, className, type = "text", ...props }: InputProps) {
  return (
    <input type={type} size={htmlSize} className={controlClasses(size, className)} {...props} />
  );
}
