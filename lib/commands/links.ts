import { env } from "@/lib/env";

/** Absolute links into the app, for e-mails. */
export function appUrl(path: string): string {
  return new URL(path, env().APP_URL).toString();
}
