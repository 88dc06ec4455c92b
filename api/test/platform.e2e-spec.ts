import request from 'supertest';
import { createTestApp, resetDatabase, type TestApp } from './test-app';
import { csrfToken, newUser, signIn } from './factories';

describe('platform (HTTP)', () => {
  let t: TestApp;

  beforeAll(async () => {
    await resetDatabase();
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.app.close();
  });

  it('GET /api/health reports the database', async () => {
    const res = await request(t.http).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('answers unknown /api routes with a JSON 404', async () => {
    const res = await request(t.http).get('/api/no-such-thing').expect(404);
    expect(res.headers['content-type']).toMatch(/application\/json/);
    expect(res.body).toMatchObject({ statusCode: 404, error: 'Not Found' });
    await request(t.http).delete('/api/no-such-thing').expect(404);
  });

  it('answers an oversized body with a JSON 413', async () => {
    const agent = request.agent(t.http);
    const token = await csrfToken(agent);
    const res = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', token)
      .send({ email: 'a@willowmere.example', password: 'x'.repeat(2_200_000) })
      .expect(413);
    expect(res.body).toEqual({
      statusCode: 413,
      message: 'The request body is too large.',
      error: 'Payload Too Large',
    });
  });

  it('sends security headers, with a CSP that allows no inline or remote script', async () => {
    const res = await request(t.http).get('/api/health');
    const csp = String(res.headers['content-security-policy']);
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("default-src 'self'");
    expect(csp).not.toMatch(/script-src[^;]*unsafe-inline/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
    // Outside production: no HSTS (plain http on loopback), but API answers are still never cached.
    expect(res.headers['strict-transport-security']).toBeUndefined();
    expect(res.headers['cache-control']).toBe('no-store');
  });

  it('serves the OpenAPI document and its page', async () => {
    const json = await request(t.http).get('/api/docs-json').expect(200);
    const paths = Object.keys((json.body as { paths: Record<string, unknown> }).paths);
    expect(paths).toEqual(
      expect.arrayContaining([
        '/api/auth/login',
        '/api/auth/csrf',
        '/api/users',
        '/api/users/{id}',
        '/api/health',
      ]),
    );
    const page = await request(t.http).get('/api/docs').expect(200);
    expect(page.headers['content-type']).toMatch(/text\/html/);
  });

  it('keeps working after the database drops every connection (as in a restart)', async () => {
    const user = await newUser(t.dataSource, { role: 'admin' });
    const { agent } = await signIn(t.http, user);
    await agent.get('/api/users').expect(200);

    // Terminate every other backend of this database: the app's pool and the session store's pool.
    await t.dataSource.query(
      `SELECT pg_terminate_backend(pid) FROM pg_stat_activity
        WHERE datname = current_database() AND pid <> pg_backend_pid()`,
    );
    await new Promise((resolve) => setTimeout(resolve, 300));

    await request(t.http).get('/api/health').expect(200);
    await agent.get('/api/users').expect(200);
    await agent.get('/api/auth/me').expect(200);
  });
});
