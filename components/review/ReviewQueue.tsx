import Link from "next/link";
import { reviewStatusText } from "@/lib/data/reviews";

export interface ReviewQueueItem {
  id: string;
  title: string;
  status: "requested" | "approved" | "withdrawn" | "none";
}

/** Review status of the trials on a home page; requests waiting for a decision first. */
export function ReviewQueue({ items, heading }: { items: ReviewQueueItem[]; heading: string }) {
  if (items.length === 0) return null;
  const order = { requested: 0, none: 1, withdrawn: 2, approved: 3 } as const;
  return (
    <section className="mb-6" aria-labelledby="review-queue-heading">
      <h2 id="review-queue-heading" className="mb-2 text-lg font-semibold">{heading}</h2>
      <ul className="divide-y divide-soil-100 rounded border border-soil-200 bg-white" data-testid="review-queue">
        {[...items].sort((a, b) => order[a.status] - order[b.status]).map((item) => (
          <li key={item.id} className="flex flex-col gap-1 p-3 sm:flex-row sm:items-center sm:gap-4">
            <Link href={`/trials/${item.id}/review`} className="flex-1 text-leaf-700 underline-offset-2 hover:underline">{item.title}</Link>
            <span className={`text-sm ${item.status === "requested" ? "font-semibold text-amber-800" : "text-soil-700"}`} data-testid="review-queue-status">
              {reviewStatusText[item.status]}
            </span>
          </li>
        ))}
      </ul>
    </section>
  );
}
