import type { ReactNode } from "react";
import { AppHeader } from "@/components/shell/app-header";
import { TimeZoneProvider } from "@/components/providers/time-zone";
import { navFor } from "@/components/shell/navigation";
import { isProduction } from "@/lib/env";
import { requireUser } from "@/lib/server/guard";

export default async function AppLayout({ children }: { children: ReactNode }) {
  const user = await requireUser();
  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2">
        Skip to content
      </a>
      <AppHeader items={navFor(user.ability, user.role, isProduction())} name={user.name} role={user.role} orgName={user.orgName} />
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        <TimeZoneProvider timeZone={user.timeZone}>{children}</TimeZoneProvider>
      </main>
    </div>
  );
}
