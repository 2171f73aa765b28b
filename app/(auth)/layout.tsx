import Link from "next/link";

export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <div className="flex min-h-screen flex-col items-center justify-center px-4 py-10">
      <Link href="/" className="mb-6 flex items-center gap-2 text-xl font-semibold text-leaf-700">
        <span aria-hidden className="inline-block h-7 w-7 rounded bg-leaf-600" />
        Hoebench
      </Link>
      <div className="w-full max-w-sm rounded-lg border border-soil-200 bg-white p-6 shadow-sm">{children}</div>
      <p className="mt-6 max-w-sm text-center text-xs text-soil-500">
        Weed-control field trials from plan to published result.
      </p>
    </div>
  );
}
