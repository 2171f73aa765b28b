/**
 * Local stand-ins for object storage and outgoing mail, on loopback only: an S3 fake
 * (s3rver) and an SMTP catcher that keeps every message and serves them over HTTP for the
 * in-app mail page and for tests. Production points the app at real services instead.
 */
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";
import { simpleParser } from "mailparser";

const s3Port = Number(process.env.FAKE_S3_PORT ?? 4569);
const smtpPort = Number(process.env.FAKE_SMTP_PORT ?? 2525);
const mailHttpPort = Number(process.env.FAKE_MAIL_HTTP_PORT ?? 2526);
const stateDir = process.env.FAKE_STATE_DIR ?? path.resolve(".hoebench/fakes");
const buckets = (process.env.FAKE_S3_BUCKETS ?? "hoebench").split(",");

const corsXml = `<CORSConfiguration><CORSRule>
  <AllowedOrigin>*</AllowedOrigin>
  <AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod>
  <AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds>
</CORSRule></CORSConfiguration>`;

interface CaughtMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

const mailDir = path.join(stateDir, "mail");
mkdirSync(mailDir, { recursive: true });

function listMail(): CaughtMail[] {
  return readdirSync(mailDir)
    .filter((name) => name.endsWith(".json"))
    .map((name) => JSON.parse(readFileSync(path.join(mailDir, name), "utf8")) as CaughtMail)
    .sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
}

function sendJson(response: ServerResponse, status: number, body: unknown): void {
  response.writeHead(status, { "content-type": "application/json" });
  response.end(JSON.stringify(body));
}

function handleMailHttp(request: IncomingMessage, response: ServerResponse): void {
  const url = new URL(request.url ?? "/", "http://127.0.0.1");
  if (url.pathname === "/health") return sendJson(response, 200, { ok: true });
  if (url.pathname === "/messages" && request.method === "GET") return sendJson(response, 200, listMail());
  if (url.pathname === "/messages" && request.method === "DELETE") {
    for (const name of readdirSync(mailDir)) rmSync(path.join(mailDir, name));
    return sendJson(response, 200, { deleted: true });
  }
  sendJson(response, 404, { error: "not found" });
}

async function main(): Promise<void> {
  const s3 = new S3rver({
    address: "127.0.0.1",
    port: s3Port,
    silent: true,
    directory: path.join(stateDir, "s3"),
    configureBuckets: buckets.map((name) => ({ name, configs: [corsXml] })),
  });
  await s3.run();

  const smtp = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then((parsed) => {
          const toField = Array.isArray(parsed.to) ? parsed.to : parsed.to ? [parsed.to] : [];
          const mail: CaughtMail = {
            id: randomUUID(),
            receivedAt: new Date().toISOString(),
            from: parsed.from?.text ?? "",
            to: toField.flatMap((group) => group.value.map((entry) => entry.address ?? "")),
            subject: parsed.subject ?? "",
            text: parsed.text ?? "",
            html: typeof parsed.html === "string" ? parsed.html : "",
          };
          writeFileSync(path.join(mailDir, `${mail.receivedAt.replace(/[:.]/g, "-")}-${mail.id}.json`), JSON.stringify(mail));
          callback();
        })
        .catch((error: Error) => callback(error));
    },
  });
  await new Promise<void>((resolve, reject) => {
    smtp.once("error", reject);
    smtp.listen(smtpPort, "127.0.0.1", () => resolve());
  });

  const http = createServer(handleMailHttp);
  await new Promise<void>((resolve) => http.listen(mailHttpPort, "127.0.0.1", () => resolve()));

  process.stdout.write(`fakes ready: s3 127.0.0.1:${s3Port}, smtp 127.0.0.1:${smtpPort}, mail http 127.0.0.1:${mailHttpPort}\n`);

  const shutdown = () => {
    http.close();
    smtp.close(() => {});
    void s3.close().finally(() => process.exit(0));
    setTimeout(() => process.exit(0), 2000).unref();
  };
  process.on("SIGINT", shutdown);
  process.on("SIGTERM", shutdown);
}

main().catch((error) => {
  process.stderr.write(`fakes failed to start: ${(error as Error).message}\n`);
  process.exit(1);
});
