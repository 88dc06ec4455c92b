import request from 'supertest';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { newUser, sessionCookie } from './factories';

// The app as NODE_ENV=production builds it, reached through a TLS proxy on the same machine (the
// proxy sets X-Forwarded-Proto: https; the app trusts the loopback hop).
describe('production mode (HTTP)', () => {
  let t: TestApp;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp({ nodeEnv: 'production' });
  });
  afterAll(async () => {
    await t.app.close();
  });

  const viaProxy = (req: request.Test, cookie?: string) => {
    const proxied = req.set('X-Forwarded-Proto', 'https');
    return cookie ? proxied.set('Cookie', cookie) : proxied;
  };

  /** Signs in through the proxy; returns the Set-Cookie line and the cookie to send back. */
  async function signInViaProxy(user: { email: string; password: string }) {
    const csrf = await viaProxy(request(t.http).get('/api/auth/csrf')).expect(200);
    const anonymous = (sessionCookie(csrf) ?? '').split(';')[0];
    const login = await viaProxy(request(t.http).post('/api/auth/login'), anonymous)
      .set('X-CSRF-Token', (csrf.body as { token: string }).token)
      .send(user)
      .expect(200);
    const line = sessionCookie(login) ?? '';
    return { line, cookie: line.split(';')[0] };
  }

  it('sets a Secure, HttpOnly session cookie', async () => {
    const { line } = await signInViaProxy(await newUser(t.dataSource));
    expect(line).toMatch(/; Secure/);
    expect(line).toMatch(/; HttpOnly/);
  });

  it('sends HSTS and Cache-Control: no-store on API answers, errors included', async () => {
    for (const [path, status] of [
      ['/api/health', 200],
      ['/api/auth/me', 401],
      ['/api/no-such-thing', 404],
    ] as const) {
      const res = await viaProxy(request(t.http).get(path)).expect(status);
      expect(res.headers['strict-transport-security']).toMatch(/max-age=\d{7,}/);
      expect(res.headers['cache-control']).toBe('no-store');
    }
  });

  it('shows the API docs only to signed-in staff', async () => {
    for (const path of ['/api/docs', '/api/docs-json']) {
      const res = await viaProxy(request(t.http).get(path)).expect(401);
      expect(res.body).toEqual({ statusCode: 401, message: 'Sign in to continue.', error: 'Unauthorized' });
    }
    const { cookie } = await signInViaProxy(await newUser(t.dataSource, { role: 'carer' }));
    const json = await viaProxy(request(t.http).get('/api/docs-json'), cookie).expect(200);
    expect(Object.keys((json.body as { paths: object }).paths)).toContain('/api/auth/password');
    const page = await viaProxy(request(t.http).get('/api/docs'), cookie).expect(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
  });
});
