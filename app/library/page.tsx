import type { Metadata } from "next";
import Link from "next/link";
import { libraryChoices, publishedTrials } from "@/lib/data/library";
import { categoryNames } from "@/lib/trials/labels";
import type { MethodCategory } from "@/lib/trials/vocabulary";
import { libraryQuerySchema, type LibraryQuery } from "@/lib/validations/library";

export const metadata: Metadata = { title: "Library of published trials" };
export const dynamic = "force-dynamic";

type Search = Record<string, string | string[] | undefined>;

function Select({ name, label, value, options }: { name: string; label: string; value?: string; options: { value: string; label: string }[] }) {
  return (
    <label className="text-sm">
      <span className="mb-1 block font-medium">{label}</span>
      <select name={name} defaultValue={value ?? ""} className="w-full rounded border border-soil-200 bg-white px-2 py-1.5">
        <option value="">Any</option>
        {options.map((option) => (
          <option key={option.value} value={option.value}>
            {option.label}
          </option>
        ))}
      </select>
    </label>
  );
}

export default async function LibraryPage({ searchParams }: { searchParams: Promise<Search> }) {
  const raw = Object.fromEntries(Object.entries(await searchParams).map(([key, value]) => [key, Array.isArray(value) ? value[0] : value]));
  const parsed = libraryQuerySchema.safeParse(raw);
  const query: Partial<LibraryQuery> = parsed.success ? parsed.data : {};
  const [trials, choices] = await Promise.all([publishedTrials(query), libraryChoices()]);
  const filtered = Object.values(query).some(Boolean);
  return (
    <section>
      <h1 className="text-2xl font-semibold">Library of published trials</h1>
      <p className="mb-4 max-w-prose text-soil-700">
        What weed-control field trials found, in words and money: how much each method cut weeds, how the crop yielded, and what it cost per acre.
      </p>
      <form role="search" aria-label="Search the library" method="get" className="mb-6 grid gap-3 rounded border border-soil-200 bg-white p-4 sm:grid-cols-2 lg:grid-cols-[2fr_1fr_1fr_1fr_1fr_auto] lg:items-end">
        <label className="text-sm">
          <span className="mb-1 block font-medium">Search</span>
          <input type="search" name="q" defaultValue={query.q ?? ""} placeholder="Crop, method, site…" className="w-full rounded border border-soil-200 px-2 py-1.5" />
        </label>
        <Select name="crop" label="Crop" value={query.crop} options={choices.crops.map((crop) => ({ value: crop, label: crop }))} />
        <Select name="method" label="Method" value={query.method} options={choices.methods.map((method) => ({ value: method, label: categoryNames[method as MethodCategory] ?? method }))} />
        <Select name="region" label="Region" value={query.region} options={choices.regions.map((region) => ({ value: region, label: region }))} />
        <Select name="season" label="Season" value={query.season} options={choices.seasons.map((season) => ({ value: season, label: season }))} />
        <div className="flex gap-2">
          <button type="submit" className="rounded bg-leaf-600 px-4 py-1.5 text-sm font-medium text-white hover:bg-leaf-700">
            Search
          </button>
          {filtered && (
            <Link href="/library" className="rounded border border-soil-200 px-3 py-1.5 text-sm">
              Clear
            </Link>
          )}
        </div>
      </form>
      {!parsed.success && <p className="mb-4 text-sm text-red-800">Some filters were not understood and were ignored.</p>}
      <p className="mb-2 text-sm text-soil-700" aria-live="polite">
        {trials.length === 1 ? "1 published trial" : `${trials.length} published trials`}
        {filtered ? " match" : ""}
      </p>
      {trials.length === 0 ? (
        <p className="rounded border border-dashed border-soil-200 bg-white p-4 text-soil-700">No published trial matches. Try fewer filters.</p>
      ) : (
        <ul className="space-y-3">
          {trials.map((trial) => (
            <li key={trial.id} className="rounded border border-soil-200 bg-white p-4" data-testid="library-entry">
              <h2 className="text-lg font-semibold">
                <Link href={`/library/${trial.id}`} className="text-leaf-700 underline-offset-2 hover:underline">
                  {trial.title}
                </Link>
              </h2>
              <p className="text-sm text-soil-700">
                {trial.crop} · {trial.season} season · {trial.siteName}, {trial.region}
              </p>
              <p className="mt-1 text-sm">Methods: {trial.methods.map((method) => method.name).join(", ")}</p>
              <p className="mt-2 flex flex-wrap gap-3 text-sm">
                <Link href={`/library/${trial.id}`} className="text-leaf-700 underline">Read the summary</Link>
                <a href={`/api/library/${trial.id}/report`} className="text-leaf-700 underline" download>Technical report (PDF)</a>
                <a href={`/api/library/${trial.id}/data`} className="text-leaf-700 underline">Download the data (CSV)</a>
              </p>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
