import Link from "next/link";
import { statusNames } from "@/lib/trials/labels";
import { trialStatuses, type TrialStatus } from "@/lib/trials/vocabulary";

const control = "w-full rounded border border-soil-200 bg-white px-3 py-2 text-base";

/** A plain GET form: filters live in the address, so a filtered list can be bookmarked. */
export function TrialFilters({
  crops,
  seasons,
  current,
}: {
  crops: string[];
  seasons: string[];
  current: { crop?: string; season?: string; status?: TrialStatus | null };
}) {
  return (
    <form method="get" action="/trials" className="mb-4 grid gap-3 rounded border border-soil-200 bg-white p-3 sm:grid-cols-[1fr_1fr_1fr_auto]" aria-label="Filter trials">
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Crop</span>
        <select name="crop" defaultValue={current.crop ?? ""} className={control}>
          <option value="">All crops</option>
          {crops.map((crop) => (
            <option key={crop} value={crop}>
              {crop}
            </option>
          ))}
        </select>
      </label>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Season</span>
        <select name="season" defaultValue={current.season ?? ""} className={control}>
          <option value="">All seasons</option>
          {seasons.map((season) => (
            <option key={season} value={season}>
              {season}
            </option>
          ))}
        </select>
      </label>
      <label className="block text-sm">
        <span className="mb-1 block font-medium">Status</span>
        <select name="status" defaultValue={current.status ?? ""} className={control}>
          <option value="">Any status</option>
          {trialStatuses.map((status) => (
            <option key={status} value={status}>
              {statusNames[status]}
            </option>
          ))}
        </select>
      </label>
      <div className="flex items-end gap-2">
        <button type="submit" className="rounded bg-leaf-600 px-4 py-2 text-sm font-medium text-white hover:bg-leaf-700">
          Filter
        </button>
        <Link href="/trials" className="rounded border border-soil-200 px-3 py-2 text-sm hover:bg-soil-100">
          Clear
        </Link>
      </div>
    </form>
  );
}
