"use client";

export function PrintButton({ label = "Print" }: { label?: string }) {
  return (
    <button type="button" onClick={() => window.print()} className="no-print rounded border border-soil-200 bg-white px-4 py-2 text-sm font-medium hover:bg-soil-100">
      {label}
    </button>
  );
}
