import type { CheckedUploadBody } from "@/lib/uploads/schemas";

export function ProblemList({ problems }: { problems: CheckedUploadBody["problems"] }) {
  if (problems.length === 0) return <p className="text-sm text-leaf-700">No problems found.</p>;
  return (
    <ul className="max-h-72 space-y-1 overflow-y-auto rounded border border-soil-200 bg-white p-3 text-sm" data-testid="problem-list">
      {problems.map((problem, index) => (
        <li key={index} className="flex gap-2">
          <span
            className={`shrink-0 rounded px-1.5 text-xs font-semibold uppercase ${problem.severity === "error" ? "bg-red-100 text-red-900" : "bg-amber-100 text-amber-900"}`}
          >
            {problem.severity === "error" ? "Error" : "Check"}
          </span>
          <span>{problem.message}</span>
        </li>
      ))}
    </ul>
  );
}
