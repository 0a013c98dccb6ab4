// A small HTTP client for the API: sends the Origin header the origin check wants and keeps the session cookie.
export interface ApiResponse<T = any> {
  status: number;
  body: T;
  headers: Headers;
}

export class ApiClient {
  cookie: string | null = null;

  constructor(
    readonly baseUrl: string,
    options: { cookie?: string | null; origin?: string | null } = {},
  ) {
    this.cookie = options.cookie ?? null;
    this.origin = options.origin === undefined ? baseUrl : options.origin;
  }

  readonly origin: string | null;

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<ApiResponse<T>> {
    const isForm = body instanceof FormData;
    const response = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers: {
        ...(this.origin ? { Origin: this.origin } : {}),
        ...(this.cookie ? { Cookie: this.cookie } : {}),
        ...(body !== undefined && !isForm ? { "Content-Type": "application/json" } : {}),
        ...headers,
      },
      body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
      redirect: "manual",
    });
    this.keepCookie(response.headers);
    const text = await response.text();
    let parsed: unknown = text;
    if ((response.headers.get("content-type") ?? "").includes("application/json") && text) parsed = JSON.parse(text);
    return { status: response.status, body: parsed as T, headers: response.headers };
  }

  // A body sent exactly as given (broken JSON, NUL bytes), with this client's cookie and origin.
  async raw<T = any>(method: string, path: string, text: string, contentType = "application/json"): Promise<ApiResponse<T>> {
    const response = await fetch(`${this.baseUrl}${path}`, {
      method,
      headers: { ...(this.origin ? { Origin: this.origin } : {}), ...(this.cookie ? { Cookie: this.cookie } : {}), "Content-Type": contentType },
      body: text,
      redirect: "manual",
    });
    const body = await response.text();
    const json = (response.headers.get("content-type") ?? "").includes("application/json") && body;
    return { status: response.status, body: (json ? JSON.parse(body) : body) as T, headers: response.headers };
  }

  get<T = any>(path: string) {
    return this.request<T>("GET", path);
  }
  post<T = any>(path: string, body?: unknown, headers?: Record<string, string>) {
    return this.request<T>("POST", path, body ?? {}, headers);
  }
  patch<T = any>(path: string, body?: unknown) {
    return this.request<T>("PATCH", path, body ?? {});
  }
  put<T = any>(path: string, body?: unknown) {
    return this.request<T>("PUT", path, body ?? {});
  }
  delete<T = any>(path: string) {
    return this.request<T>("DELETE", path);
  }

  upload<T = any>(path: string, file: { name: string; type: string; content: Buffer | string }, fields: Record<string, string> = {}) {
    const form = new FormData();
    for (const [key, value] of Object.entries(fields)) form.append(key, value);
    form.append("file", new Blob([typeof file.content === "string" ? file.content : new Uint8Array(file.content)], { type: file.type }), file.name);
    return this.request<T>("POST", path, form);
  }

  private keepCookie(headers: Headers) {
    for (const line of headers.getSetCookie()) {
      const [pair] = line.split(";");
      const [name, value] = pair.split("=");
      if (name !== "portfold_session") continue;
      this.cookie = value ? `${name}=${value}` : null;
    }
  }
}
