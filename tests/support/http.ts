import { DEMO_PASSWORD } from "@/lib/demo/scenario";
import { testEnvironment } from "./environment";

/** A signed-in (or signed-out) client of the running test server, keeping its cookies. */
export class TestClient {
  private cookies = new Map<string, string>();
  readonly baseUrl = testEnvironment().baseUrl;

  /** extraHeaders go with every request (a client address behind a proxy, say). */
  constructor(private readonly extraHeaders: Record<string, string> = {}) {}

  private remember(response: Response): void {
    for (const header of response.headers.getSetCookie()) {
      const [pair] = header.split(";");
      const index = pair.indexOf("=");
      this.cookies.set(pair.slice(0, index), pair.slice(index + 1));
    }
  }

  private cookieHeader(): string {
    return [...this.cookies].map(([name, value]) => `${name}=${value}`).join("; ");
  }

  async request(path: string, init: RequestInit & { json?: unknown } = {}): Promise<Response> {
    const { json, ...rest } = init;
    const response = await fetch(new URL(path, this.baseUrl), {
      redirect: "manual",
      ...rest,
      headers: {
        ...this.extraHeaders,
        cookie: this.cookieHeader(),
        ...(json !== undefined ? { "content-type": "application/json" } : {}),
        ...rest.headers,
      },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
    this.remember(response);
    return response;
  }

  /** The last sign-in answer's body (next-auth names an error code in it). */
  lastSignInBody = "";

  async signIn(email: string, password = DEMO_PASSWORD): Promise<boolean> {
    const csrf = await this.request("/api/auth/csrf");
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const answer = await this.request("/api/auth/callback/credentials", {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ csrfToken, email, password, json: "true" }).toString(),
    });
    this.lastSignInBody = `${answer.headers.get("location") ?? ""} ${await answer.text()}`;
    return [...this.cookies.keys()].some((name) => name.endsWith("next-auth.session-token"));
  }
}

export async function signedInAs(email: string): Promise<TestClient> {
  const client = new TestClient();
  if (!(await client.signIn(email))) throw new Error(`could not sign in as ${email}`);
  return client;
}

/** Signs in with a bare form post, as a browser does, and returns the session cookie's raw Set-Cookie header. */
export async function signInSetCookie(email: string, password = DEMO_PASSWORD): Promise<string | undefined> {
  const url = (path: string) => new URL(path, testEnvironment().baseUrl);
  const csrf = await fetch(url("/api/auth/csrf"));
  const csrfCookie = csrf.headers.getSetCookie().map((cookie) => cookie.split(";")[0]).join("; ");
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const answer = await fetch(url("/api/auth/callback/credentials"), {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: csrfCookie },
    body: new URLSearchParams({ csrfToken, email, password, json: "true" }).toString(),
  });
  return answer.headers.getSetCookie().find((cookie) => /^(__Secure-)?next-auth\.session-token=/.test(cookie));
}
