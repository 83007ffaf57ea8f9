import Link from "next/link";
import { signOutAction } from "@/app/(auth)/actions";
import { Logo } from "@/components/brand";
import { Button } from "@/components/ui";
import { ROLE_LABELS, type Role } from "@/lib/permissions";
import type { NavItem } from "./navigation";
import { NavLinks } from "./nav-links";

export function AppHeader({ items, name, role, orgName }: { items: NavItem[]; name: string; role: Role; orgName: string }) {
  return (
    <header className="border-b border-line bg-night-900 text-white">
      <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
        <Link href="/" className="rounded-sm focus-visible:outline-3 focus-visible:outline-offset-2" aria-label="Rigline home">
          <Logo size={30} mono />
        </Link>
        <nav aria-label="Main" className="order-3 w-full md:order-none md:w-auto md:flex-1">
          <NavLinks items={items.map(({ href, label }) => ({ href, label }))} />
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <Link href="/profile" className="text-right leading-tight hover:underline" data-testid="current-user">
            <span className="block font-semibold">{name}</span>
            <span className="block text-white/75">
              {ROLE_LABELS[role]} · {orgName}
            </span>
          </Link>
          <form action={signOutAction}>
            <Button type="submit" variant="secondary" size="sm">
              Sign out
            </Button>
          </form>
        </div>
      </div>
    </header>
  );
}
