import Link from "next/link";
import { Logo } from "./Logo";
import { SignOutButton } from "./SignOutButton";
import { NavLink } from "./NavLink";
import { roleMay, ROLE_LABEL, type Access } from "@/lib/auth/permissions";
import type { SignedInUser } from "@/lib/contracts/users";

const LINKS: { href: string; label: string; access: Access }[] = [
  { href: "/floor-plans", label: "Floor plans", access: "floorplans.read" },
  { href: "/floor", label: "Floor", access: "floor.watch" },
  { href: "/waves", label: "Waves", access: "waves.read" },
  { href: "/orders", label: "Orders", access: "waves.read" },
  { href: "/items", label: "Item master", access: "waves.read" },
  { href: "/short-picks", label: "Short picks", access: "shortpicks.follow" },
  { href: "/my-batches", label: "My batches", access: "picks.work" },
  { href: "/admin/users", label: "Users", access: "users.manage" },
  { href: "/admin/mail", label: "Mail", access: "users.manage" },
  { href: "/admin/settings", label: "Settings", access: "site.manage" },
];

export function NavBar({ user }: { user: SignedInUser }) {
  const links = LINKS.filter((l) => roleMay(user.role, l.access));
  return (
    <header className="border-b-4 border-trail bg-ink text-paper print:hidden">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-2">
        <Link href="/" className="flex min-h-tap items-center gap-2 font-bold text-lg">
          <Logo className="h-8 w-8" />
          Trailbin
        </Link>
        <nav aria-label="Main" className="flex flex-1 flex-wrap gap-1">
          {links.map((l) => (
            <NavLink key={l.href} href={l.href}>
              {l.label}
            </NavLink>
          ))}
        </nav>
        <div className="flex items-center gap-3">
          <p className="text-sm leading-tight">
            <span className="block font-semibold">{user.displayName}</span>
            <span className="block text-paper-sunk">{ROLE_LABEL[user.role]}</span>
          </p>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
