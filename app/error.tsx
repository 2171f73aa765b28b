"use client";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <div className="mx-auto max-w-lg px-4 py-16 text-center">
      <h1 className="text-2xl font-semibold">Something went wrong</h1>
      <p className="mt-2 text-soil-700">Nothing you entered was changed. Try again; if it keeps happening, tell your administrator.</p>
      <button type="button" onClick={reset} className="mt-4 rounded bg-leaf-600 px-4 py-2 text-white">
        Try again
      </button>
    </div>
  );
}
