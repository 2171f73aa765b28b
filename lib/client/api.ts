/** Client-side fetch of our JSON APIs; failures come back as the server's message and field problems. */
export interface ApiFailure {
  code: string;
  message: string;
  fields?: { path: string; message: string }[];
}

export type ApiResult<T> = { ok: true; data: T } | { ok: false; error: ApiFailure };

export async function callApi<T>(url: string, init: RequestInit & { json?: unknown } = {}): Promise<ApiResult<T>> {
  const { json, ...rest } = init;
  try {
    const response = await fetch(url, {
      ...rest,
      headers: { ...(json !== undefined ? { "content-type": "application/json" } : {}), ...rest.headers },
      body: json !== undefined ? JSON.stringify(json) : rest.body,
    });
    const body = await response.json().catch(() => null);
    if (!response.ok) {
      return { ok: false, error: body?.error ?? { code: `HTTP_${response.status}`, message: `The server answered ${response.status}.` } };
    }
    return { ok: true, data: body as T };
  } catch {
    return { ok: false, error: { code: "NETWORK", message: "No connection to the server. Nothing was lost; try again." } };
  }
}

export function fieldErrors(error: ApiFailure): Record<string, string> {
  return Object.fromEntries((error.fields ?? []).map((field) => [field.path, field.message]));
}
