"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";
import { useState } from "react";
import { cn } from "@/lib/cn";

export interface NavLinksProps {
  items: { href: string; label: string }[];
}

/** The section menu: a bar on wide screens, a folding list on a phone. */
export function NavLinks({ items }: NavLinksProps) {
  const pathname = usePathname();
  const [open, setOpen] = useState(false);
  return (
    <nav aria-label="Sections" className="w-full md:w-auto">
      <button
        type="button"
        className="min-h-touch w-full rounded-md border border-white/30 px-3 text-left font-bold text-white md:hidden"
        aria-expanded={open}
        aria-controls="section-menu"
        onClick={() => setOpen((v) => !v)}
      >
        {open ? "Close menu ▲" : "Menu ▼"}
      </button>
      <ul id="section-menu" className={cn("mt-2 flex-col gap-1 md:mt-0 md:flex md:flex-row md:flex-wrap", open ? "flex" : "hidden")}>
        {items.map((item) => {
          const active = pathname === item.href || pathname.startsWith(`${item.href}/`);
          return (
            <li key={item.href}>
              <Link
                href={item.href}
                aria-current={active ? "page" : undefined}
                onClick={() => setOpen(false)}
                className={cn(
                  "flex min-h-11 items-center rounded-md px-3 text-sm font-bold text-white no-underline hover:bg-white/15 hover:no-underline",
                  active && "bg-white/20 underline decoration-amber-light decoration-2 underline-offset-4",
                )}
              >
                {item.label}
              </Link>
            </li>
          );
        })}
      </ul>
    </nav>
  );
}
