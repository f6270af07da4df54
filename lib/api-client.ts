/** The error body every API route answers with (API.md). */
export interface ApiErrorBody {
  error: { code: string; message: string; fields?: Record<string, string[]> };
}

export class ApiError extends Error {
  constructor(
    public readonly status: number,
    public readonly body: ApiErrorBody | null,
  ) {
    super(body?.error.message ?? `The server answered ${status}.`);
  }
}

/** Calls our public API from the browser; JSON in and out, errors as ApiError with the server's message. */
export async function apiFetch<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, headers, ...rest } = init;
  const response = await fetch(path, {
    ...rest,
    headers: { ...(json !== undefined ? { "content-type": "application/json" } : {}), ...headers },
    body: json !== undefined ? JSON.stringify(json) : rest.body,
    credentials: "same-origin",
  });
  if (response.status === 401 && typeof window !== "undefined") {
    window.location.replace(new URL("/sign-in", window.location.origin).href);
  }
  const text = await response.text();
  const body = text ? (JSON.parse(text) as unknown) : null;
  if (!response.ok) throw new ApiError(response.status, body as ApiErrorBody | null);
  return body as T;
}
