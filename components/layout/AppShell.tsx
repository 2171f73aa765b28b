import Link from "next/link";
import { config } from "@/lib/config";
import { roleLabels } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session";
import { navigationFor } from "@/lib/navigation";
import { SignOutButton } from "./SignOutButton";
import { MobileMenu } from "./MobileMenu";

export function AppShell({ user, children }: { user: SessionUser; children: React.ReactNode }) {
  const navigation = navigationFor(user.role, { mailCatcher: Boolean(config().MAIL_CATCHER_URL) });
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-soil-200 bg-white">
        <div className="mx-auto flex max-w-6xl items-center gap-4 px-4 py-3">
          <Link href="/" className="flex items-center gap-2 font-semibold text-leaf-700">
            <span aria-hidden className="inline-block h-6 w-6 rounded bg-leaf-600" />
            Hoebench
          </Link>
          <nav aria-label="Main" className="hidden flex-1 gap-1 md:flex">
            {navigation.map((item) => (
              <Link key={item.href} href={item.href} className="rounded px-3 py-2 text-sm text-soil-700 hover:bg-soil-100">
                {item.label}
              </Link>
            ))}
          </nav>
          <div className="ml-auto hidden items-center gap-3 md:flex">
            <span className="text-sm text-soil-700" data-testid="signed-in-as">
              {user.name} · {roleLabels[user.role]}
            </span>
            <SignOutButton />
          </div>
          <MobileMenu items={navigation} userLine={`${user.name} · ${roleLabels[user.role]}`} />
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-4 py-6">{children}</main>
    </div>
  );
}
