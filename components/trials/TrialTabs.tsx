import Link from "next/link";

const tabs = [
  { key: "overview", label: "Overview", path: "" },
  { key: "plan", label: "Plan", path: "/plan/basics" },
  { key: "map", label: "Plot map", path: "/map" },
  { key: "labels", label: "Stake labels", path: "/labels" },
  { key: "sheets", label: "Data sheets", path: "/sheets" },
  { key: "data", label: "Field data", path: "/data" },
  { key: "results", label: "Results", path: "/results" },
  { key: "review", label: "Review", path: "/review" },
  { key: "report", label: "Report", path: "/report" },
  { key: "summary", label: "Summary", path: "/summary" },
  { key: "audit", label: "Audit trail", path: "/audit" },
] as const;
export type TrialTab = (typeof tabs)[number]["key"];

/** The trial's own sections; "Plan" only for those who may edit it. */
export function TrialTabs({ trialId, current, canPlan }: { trialId: string; current: TrialTab; canPlan: boolean }) {
  return (
    <nav aria-label="Trial sections" className="no-print mb-6 overflow-x-auto border-b border-soil-200">
      <ul className="flex min-w-max gap-1 text-sm">
        {tabs
          .filter((tab) => canPlan || tab.key !== "plan")
          .map((tab) => {
            const active = tab.key === current;
            return (
              <li key={tab.key}>
                <Link
                  href={`/trials/${trialId}${tab.path}`}
                  aria-current={active ? "page" : undefined}
                  className={`block border-b-2 px-3 py-2 ${active ? "border-leaf-600 font-medium text-leaf-700" : "border-transparent text-soil-700 hover:text-soil-900"}`}
                >
                  {tab.label}
                </Link>
              </li>
            );
          })}
      </ul>
    </nav>
  );
}
