import type { Role } from '@tallyfit/contracts';
import { DEMO_PASSWORD } from './tallyfit-server';

/** Calls the running API directly, as a pipeline or a second browser would. */
export class DemoApi {
  private constructor(
    private readonly baseUrl: string,
    private readonly token: string,
  ) {}

  static async signIn(baseUrl: string, role: Role): Promise<DemoApi> {
    const response = await fetch(`${baseUrl}/api/v1/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: `${role}@demo.tallyfit.local`, password: DEMO_PASSWORD }),
    });
    if (!response.ok) throw new Error(`demo ${role} could not sign in: ${response.status} ${await response.text()}`);
    const body = (await response.json()) as { accessToken: string };
    return new DemoApi(baseUrl, body.accessToken);
  }

  /** The raw answer, for tests that expect a refusal. */
  async call(method: string, path: string, body?: unknown): Promise<{ status: number; body: unknown }> {
    const response = await fetch(`${this.baseUrl}/api/v1${path}`, {
      method,
      headers: { Authorization: `Bearer ${this.token}`, ...(body === undefined ? {} : { 'Content-Type': 'application/json' }) },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const text = await response.text();
    return { status: response.status, body: text ? JSON.parse(text) : null };
  }

  /** The answer's body, failing the test on anything but success. */
  async expectOk<T>(method: string, path: string, body?: unknown): Promise<T> {
    const answer = await this.call(method, path, body);
    if (answer.status >= 300) throw new Error(`${method} ${path} answered ${answer.status}: ${JSON.stringify(answer.body)}`);
    return answer.body as T;
  }
}
