"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

/** Marks the current section with aria-current and an underline, not colour alone. */
export function NavLink({ href, children }: { href: string; children: React.ReactNode }) {
  const current = usePathname().startsWith(href);
  return (
    <Link
      href={href}
      aria-current={current ? "page" : undefined}
      className={`flex min-h-tap items-center rounded-md px-3 font-semibold hover:bg-ink-soft ${current ? "underline decoration-4 underline-offset-8 decoration-trail-light" : ""}`}
    >
      {children}
    </Link>
  );
}
