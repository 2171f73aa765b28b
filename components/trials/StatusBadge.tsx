import type { TrialStatus } from "@/models/Trial";

// Each status differs in wording and border style too, so it reads in greyscale print.
const styles: Record<TrialStatus, string> = {
  draft: "border-dashed border-soil-500 text-soil-700",
  active: "border-solid border-leaf-600 text-leaf-700",
  locked: "border-double border-4 border-soil-700 text-soil-900",
  published: "border-solid border-leaf-900 bg-leaf-50 text-leaf-900",
};

const labels: Record<TrialStatus, string> = { draft: "Draft", active: "Active", locked: "Locked", published: "Published" };

export function StatusBadge({ status }: { status: TrialStatus }) {
  return <span className={`inline-block rounded border px-2 py-0.5 text-xs font-medium ${styles[status]}`}>{labels[status]}</span>;
}
