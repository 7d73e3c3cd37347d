/** One signed-in browser-like client over real HTTP (fetch): keeps its session cookie and CSRF token. */
export class HttpSession {
  cookie = "";
  csrf = "";
  constructor(readonly baseUrl: string) {}

  private keepCookie(res: Response) {
    const sid = res.headers.getSetCookie().find((c) => c.startsWith("isobatch.sid="));
    if (sid) this.cookie = sid.split(";")[0];
  }

  /** Sends one request with the cookie and token; the body is read as JSON when there is one. */
  async request(method: string, path: string, body?: unknown): Promise<{ status: number; body: any; text: string }> {
    const headers: Record<string, string> = {};
    if (this.cookie) headers.cookie = this.cookie;
    if (method !== "GET") headers["x-csrf-token"] = this.csrf;
    if (body !== undefined) headers["content-type"] = "application/json";
    const res = await fetch(this.baseUrl + path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
    this.keepCookie(res);
    const text = await res.text();
    let parsed: unknown = null;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      parsed = null;
    }
    return { status: res.status, body: parsed, text };
  }

  get(path: string) {
    return this.request("GET", path);
  }

  post(path: string, body: unknown = {}) {
    return this.request("POST", path, body);
  }

  /** Reads a CSRF token, signs in and keeps the new session; throws when refused. */
  async signIn(email: string, password: string): Promise<this> {
    const first = await this.get("/api/session");
    this.csrf = first.body.csrfToken;
    const res = await this.post("/api/session", { email, password });
    if (res.status !== 200) throw new Error(`sign-in of ${email} refused: ${res.status} ${res.text.slice(0, 200)}`);
    this.csrf = res.body.csrfToken;
    return this;
  }
}
