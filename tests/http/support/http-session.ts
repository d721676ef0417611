import { z } from 'zod';

const csrfSchema = z.object({ csrfToken: z.string().min(1) });
const callbackSchema = z.object({ url: z.string() });

export type SignInResult = { ok: boolean; status: number; error: string | null };

/** A cookie jar plus fetch, signing in through next-auth's own endpoints as a browser would. */
export class HttpSession {
  private readonly cookies = new Map<string, string>();
  /** The raw Set-Cookie lines seen, by cookie name (latest wins), to check cookie attributes. */
  readonly setCookieLines = new Map<string, string>();

  constructor(private readonly baseUrl: string) {}

  private store(response: Response): void {
    for (const line of response.headers.getSetCookie()) {
      const [pair, ...attributes] = line.split(';');
      const eq = pair.indexOf('=');
      const name = pair.slice(0, eq).trim();
      const value = pair.slice(eq + 1).trim();
      this.setCookieLines.set(name, line);
      const expired = attributes.some((a) => /^\s*max-age=0/i.test(a) || /^\s*expires=thu, 01 jan 1970/i.test(a));
      if (expired || value === '') this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  /** The Cookie header this session sends (for requests made without fetch, e.g. node:http). */
  cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  cookieNames(): string[] {
    return [...this.cookies.keys()];
  }

  async fetch(path: string, init: RequestInit = {}): Promise<Response> {
    const headers = new Headers(init.headers);
    if (this.cookies.size > 0) headers.set('cookie', [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; '));
    const response = await fetch(`${this.baseUrl}${path}`, { ...init, headers, redirect: 'manual' });
    this.store(response);
    return response;
  }

  async json(path: string, init: RequestInit = {}): Promise<{ status: number; body: unknown; contentType: string }> {
    const response = await this.fetch(path, init);
    const contentType = response.headers.get('content-type') ?? '';
    const body: unknown = contentType.includes('application/json') ? await response.json() : await response.text();
    return { status: response.status, body, contentType };
  }

  /** GET /api/auth/csrf, then POST /api/auth/callback/credentials with json=true (next-auth 4's own flow). */
  async signIn(email: string, password: string): Promise<SignInResult> {
    const csrf = csrfSchema.parse(await (await this.fetch('/api/auth/csrf')).json());
    const response = await this.fetch('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: 'true', callbackUrl: `${this.baseUrl}/` }),
    });
    const { url } = callbackSchema.parse(await response.json());
    const error = new URL(url, this.baseUrl).searchParams.get('error');
    return { ok: response.ok && !error, status: response.status, error };
  }
}

export async function signedIn(baseUrl: string, email: string, password: string): Promise<HttpSession> {
  const session = new HttpSession(baseUrl);
  const result = await session.signIn(email, password);
  if (!result.ok) throw new Error(`Sign-in as ${email} failed: ${result.error ?? result.status}`);
  return session;
}
