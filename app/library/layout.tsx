import Link from "next/link";
import { currentUser } from "@/lib/auth/session";

/** The public library's own simple frame: readable without an account, with a way in. */
export default async function LibraryLayout({ children }: { children: React.ReactNode }) {
  const user = await currentUser();
  return (
    <div className="min-h-screen">
      <header className="no-print border-b border-soil-200 bg-white">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-3 px-4 py-3">
          <Link href="/library" className="flex items-center gap-2 font-semibold text-leaf-700">
            <span aria-hidden className="inline-block h-6 w-6 rounded bg-leaf-600" />
            Hoebench library
          </Link>
          <span className="hidden text-sm text-soil-700 sm:inline">Published weed-control trials, in plain words</span>
          <nav aria-label="Library" className="ml-auto flex items-center gap-3 text-sm">
            {user ? (
              <Link href="/" className="rounded border border-soil-200 px-3 py-1.5 text-soil-900 hover:bg-soil-100">
                Back to Hoebench
              </Link>
            ) : (
              <Link href="/signin" className="rounded bg-leaf-600 px-3 py-1.5 font-medium text-white hover:bg-leaf-700">
                Sign in
              </Link>
            )}
          </nav>
        </div>
      </header>
      <main className="mx-auto max-w-5xl px-4 py-6">{children}</main>
      <footer className="mx-auto max-w-5xl px-4 pb-8 text-xs text-soil-700">
        Results are from the stated site and season and are not a recommendation. The product label and local regulations govern.
      </footer>
    </div>
  );
}
