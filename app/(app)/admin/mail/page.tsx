import type { Metadata } from "next";
import { notFound, redirect } from "next/navigation";
import { can } from "@/lib/auth/permissions";
import { currentUser } from "@/lib/auth/session";
import { caughtMail } from "@/lib/data/caught-mail";
import { previewDocument } from "@/lib/mail/caught-preview";

export const metadata: Metadata = { title: "Caught mail" };
export const dynamic = "force-dynamic";

// Each message is its own framed document; a long history would make the page heavy.
const SHOWN = 40;

export default async function CaughtMailPage() {
  const user = await currentUser();
  if (!user) redirect("/signin");
  if (!can(user.role, "mail:read-caught")) notFound();
  const messages = await caughtMail().catch(() => undefined);
  if (messages === null) notFound();
  return (
    <section>
      <h1 className="text-2xl font-semibold">Caught mail</h1>
      <p className="mb-4 text-soil-700">
        On this development machine no mail leaves: everything Hoebench sends is held by the local catcher and shown here. Links in a message open in a new tab.
      </p>
      {messages === undefined && <p role="alert" className="rounded bg-red-50 p-3 text-red-800">The local mail catcher is not answering.</p>}
      {messages?.length === 0 && <p className="rounded border border-dashed border-soil-200 bg-white p-6">No mail caught yet.</p>}
      {messages && messages.length > SHOWN && (
        <p className="mb-3 text-sm text-soil-700">
          Showing the newest {SHOWN} of {messages.length} messages.
        </p>
      )}
      <ul className="space-y-3">
        {messages?.slice(0, SHOWN).map((message) => (
          <li key={message.id} className="rounded border border-soil-200 bg-white p-4" data-testid="caught-mail">
            <p className="font-medium">{message.subject || "(no subject)"}</p>
            <p className="text-sm text-soil-700">
              To {message.to.join(", ")} · from {message.from} · {new Date(message.receivedAt).toLocaleString("en-GB", { timeZone: "UTC" })} UTC
            </p>
            {message.html ? (
              <>
                <iframe
                  title={`Mail: ${message.subject || "(no subject)"}`}
                  srcDoc={previewDocument(message.html)}
                  sandbox="allow-popups allow-popups-to-escape-sandbox"
                  referrerPolicy="no-referrer"
                  className="mt-3 h-96 w-full rounded border border-soil-200 bg-white"
                  data-testid="caught-mail-html"
                />
                <details className="mt-2 text-sm">
                  <summary className="cursor-pointer text-soil-700">Plain-text part</summary>
                  <pre className="mt-2 whitespace-pre-wrap break-words">{message.text}</pre>
                </details>
              </>
            ) : (
              <pre className="mt-2 whitespace-pre-wrap break-words text-sm">{message.text}</pre>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
