import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { queueCounts, queuedMail } from "@/lib/mail/queue-view";
import { mailStatuses, type MailStatus } from "@/models/MailMessage";
import { RetryButton } from "./RetryButton";

export const metadata: Metadata = { title: "Mail queue" };
export const dynamic = "force-dynamic";

const when = (date: Date | null) => (date ? `${date.toLocaleString("en-GB", { timeZone: "UTC" })} UTC` : "—");
const statusStyle: Record<MailStatus, string> = {
  pending: "bg-soil-100 text-soil-900",
  sending: "bg-soil-100 text-soil-900",
  sent: "bg-leaf-50 text-leaf-900",
  failed: "bg-red-50 text-red-800",
};

export default async function MailQueuePage({ searchParams }: { searchParams: Promise<{ status?: string }> }) {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "mail:manage-queue")) notFound();
  const { status: rawStatus } = await searchParams;
  const status = mailStatuses.find((candidate) => candidate === rawStatus);
  const [counts, rows] = await Promise.all([queueCounts(), queuedMail(status)]);
  return (
    <section>
      <h1 className="text-2xl font-semibold">Mail queue</h1>
      <p className="mb-4 text-soil-700">
        Every e-mail Hoebench sends waits here until the mail server takes it. Failed attempts are retried after 1 and 5 minutes, half an hour and two
        hours; after that the message is marked failed until you retry it.
      </p>
      <nav aria-label="Filter by status" className="mb-4 flex flex-wrap gap-2 text-sm">
        <Link href="/admin/mail-queue" className={`rounded border px-3 py-1 ${!status ? "border-leaf-600 bg-leaf-50" : "border-soil-200 bg-white"}`}>
          All
        </Link>
        {mailStatuses.map((candidate) => (
          <Link key={candidate} href={`/admin/mail-queue?status=${candidate}`} className={`rounded border px-3 py-1 ${status === candidate ? "border-leaf-600 bg-leaf-50" : "border-soil-200 bg-white"}`} data-testid={`count-${candidate}`}>
            {candidate} ({counts[candidate]})
          </Link>
        ))}
      </nav>
      {rows.length === 0 ? (
        <p className="rounded border border-dashed border-soil-200 bg-white p-6">No messages{status ? ` with status ${status}` : ""}.</p>
      ) : (
        <div className="overflow-x-auto rounded border border-soil-200 bg-white">
          <table className="w-full text-left text-sm">
            <thead className="bg-soil-50 text-soil-700">
              <tr>
                <th className="px-3 py-2">Status</th>
                <th className="px-3 py-2">To</th>
                <th className="px-3 py-2">Subject</th>
                <th className="px-3 py-2">Attempts</th>
                <th className="px-3 py-2">Queued</th>
                <th className="px-3 py-2">Sent / next attempt</th>
                <th className="px-3 py-2">Last error</th>
                <th className="px-3 py-2"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {rows.map((row) => (
                <tr key={row.id} className="border-t border-soil-100 align-top" data-testid="queued-mail">
                  <td className="px-3 py-2">
                    <span className={`rounded px-2 py-0.5 text-xs font-medium ${statusStyle[row.status]}`}>{row.status}</span>
                  </td>
                  <td className="px-3 py-2">{row.toAddress}</td>
                  <td className="px-3 py-2">{row.subject}</td>
                  <td className="px-3 py-2">{row.attempts}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{when(row.createdAt)}</td>
                  <td className="px-3 py-2 whitespace-nowrap">{row.status === "sent" ? when(row.sentAt) : row.status === "pending" ? when(row.nextAttemptAt) : "—"}</td>
                  <td className="max-w-xs break-words px-3 py-2 text-red-800">{row.lastError ?? ""}</td>
                  <td className="px-3 py-2">{(row.status === "failed" || (row.status === "pending" && row.attempts > 0)) && <RetryButton id={row.id} />}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
