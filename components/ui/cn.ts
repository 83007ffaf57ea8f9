import { clsx, type ClassValue } from "clsx";

/** Joins class names, skipping falsy values (a thin wrapper so components share one helper). */
export function cn(...inputs: ClassValue[]): string {
  return clsx(inputs);
}

export type { ClassValue };
