import Link from "next/link";
import type { TrialStatus } from "@/lib/trials/vocabulary";
import { StatusBadge } from "./StatusBadge";

export function TrialHeading({ title, status, lines, back = { href: "/trials", label: "Trials" } }: { title: string; status: TrialStatus; lines: string[]; back?: { href: string; label: string } }) {
  return (
    <header className="mb-4">
      <p className="no-print mb-1 text-sm">
        <Link href={back.href} className="text-leaf-700 underline">
          ← {back.label}
        </Link>
      </p>
      <div className="flex flex-wrap items-start gap-3">
        <h1 className="text-2xl font-semibold">{title}</h1>
        <StatusBadge status={status} />
      </div>
      {lines.map((line) => (
        <p key={line} className="text-sm text-soil-700">
          {line}
        </p>
      ))}
    </header>
  );
}
