"use client";

import Link from "next/link";
import { useState } from "react";
import type { NavItem } from "@/lib/navigation";
import { SignOutButton } from "./SignOutButton";

export function MobileMenu({ items, userLine }: { items: NavItem[]; userLine: string }) {
  const [open, setOpen] = useState(false);
  return (
    <div className="ml-auto md:hidden">
      <button
        type="button"
        aria-expanded={open}
        aria-controls="mobile-menu"
        onClick={() => setOpen((value) => !value)}
        className="rounded border border-soil-200 px-3 py-1.5 text-sm"
      >
        Menu
      </button>
      {open && (
        <div id="mobile-menu" className="absolute inset-x-0 top-14 z-20 border-b border-soil-200 bg-white px-4 pb-4 shadow">
          <nav aria-label="Main (mobile)" className="flex flex-col">
            {items.map((item) => (
              <Link key={item.href} href={item.href} onClick={() => setOpen(false)} className="border-b border-soil-100 py-3">
                {item.label}
              </Link>
            ))}
          </nav>
          <p className="mt-3 text-sm text-soil-700">{userLine}</p>
          <SignOutButton className="mt-2 w-full" />
        </div>
      )}
    </div>
  );
}
