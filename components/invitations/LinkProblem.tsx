import Link from "next/link";

/** Why a link from an e-mail cannot be used, and the way forward. */
export function LinkProblem({ title, message, next }: { title: string; message: string; next?: { href: string; label: string } }) {
  return (
    <div className="space-y-4">
      <h1 className="text-lg font-semibold">{title}</h1>
      <p role="alert" className="rounded bg-red-50 px-3 py-2 text-sm text-red-800" data-testid="link-problem">
        {message}
      </p>
      {next && (
        <p className="text-sm">
          <Link href={next.href} className="text-leaf-700 underline">
            {next.label}
          </Link>
        </p>
      )}
    </div>
  );
}
