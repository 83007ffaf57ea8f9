import type { ReactNode } from "react";
import { Logo } from "@/components/brand";

/** The quiet shell of the pages before sign-in. */
export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center justify-center gap-8 bg-surface-sunken px-4 py-10">
      <Logo size={40} />
      <main className="w-full max-w-md">{children}</main>
      <p className="max-w-md text-center text-sm text-muted">
        Rigline keeps remote-area vehicles fitted to one standard, inside their mass limits, with the work proven.
      </p>
    </div>
  );
}
