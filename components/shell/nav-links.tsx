"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { cn } from "@/components/ui";

export function NavLinks({ items }: { items: { href: string; label: string }[] }) {
  const pathname = usePathname();
  return (
    <ul className="flex flex-wrap gap-1">
      <li>
        <NavLink href="/" label="Home" active={pathname === "/"} />
      </li>
      {items.map((item) => (
        <li key={item.href}>
          <NavLink href={item.href} label={item.label} active={pathname === item.href || pathname.startsWith(item.href + "/")} />
        </li>
      ))}
    </ul>
  );
}

function NavLink({ href, label, active }: { href: string; label: string; active: boolean }) {
  return (
    <Link
      href={href}
      aria-current={active ? "page" : undefined}
      className={cn(
        "inline-flex min-h-10 items-center rounded-md px-3 text-sm font-semibold text-white/85 hover:bg-white/10 hover:text-white",
        active && "bg-white/15 text-white underline decoration-spinifex-300 decoration-2 underline-offset-8",
      )}
    >
      {label}
    </Link>
  );
}
