import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { testApp, agent } from '../helpers/test-app';
import { gardenWithMembers, signIn } from '../helpers/factories';

const app = testApp();

describe('bad input and headers', () => {
  it('when the JSON is malformed, then 400 malformed_json without a stack', async () => {
    const res = await request(app).post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.c",');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('malformed_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts|SyntaxError|node_modules/);
    expect(res.body.error.requestId).toBe(res.headers['x-request-id']);
  });

  it('when a body claims a compression it does not have, then 400 malformed_body before sign-in, and one log line, no stack', async () => {
    for (const encoding of ['gzip', 'deflate', 'br']) {
      const res = await request(app).post('/api/auth/login').set('Content-Type', 'application/json').set('Content-Encoding', encoding).send('{"email":"a@b.c","password":"x"}');
      expect(res.status, encoding).toBe(400);
      expect(res.body.error.code).toBe('malformed_body');
      expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts|zlib|node_modules/);
    }
    const unknown = await request(app).post('/api/auth/login').set('Content-Type', 'application/json').set('Content-Encoding', 'x-lzma').send('{}');
    expect(unknown.status).toBe(415);
  });

  it('when the body is 200 kB, then 413', async () => {
    const res = await request(app)
      .post('/api/auth/register')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.co', password: 'x'.repeat(200_000), name: 'n', gardenName: 'g' }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
  });

  it('when an unknown field is sent, then 400 naming it', async () => {
    const res = await request(app).post('/api/auth/login').send({ email: 'a@b.co', password: 'whatever-pass', remember: true });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toEqual({ remember: 'Unknown field "remember" is not accepted.' });
  });

  it('when a field is missing or malformed, then 400 names it in words', async () => {
    const res = await request(app).post('/api/auth/register').send({ email: 'not-an-email', password: 'short', name: '' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toMatchObject({
      email: expect.stringMatching(/valid e-mail/),
      password: expect.stringMatching(/at least 10/),
      name: expect.stringMatching(/required/),
      gardenName: expect.stringMatching(/required/),
    });
  });

  it('when a change is sent as a form post or from another site, then it is refused (CSRF)', async () => {
    const form = await request(app).post('/api/auth/login').type('form').send('email=a@b.co&password=x');
    expect(form.status).toBe(415);
    const bare = await request(app).post('/api/auth/logout');
    expect(bare.status).toBe(403);
    const cross = await request(app).post('/api/auth/login').set('Sec-Fetch-Site', 'cross-site').send({ email: 'a@b.co', password: 'x' });
    expect(cross.status).toBe(403);
    expect(cross.body.error.code).toBe('cross_site_rejected');
  });

  it('when any API answers, then security headers are set and X-Powered-By is absent', async () => {
    const res = await request(app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("object-src 'none'");
    expect(csp).toContain("base-uri 'none'");
    expect(csp).toContain("frame-ancestors 'none'");
  });

  it('when an unknown API path is asked for, then a JSON 404', async () => {
    const { owner } = await gardenWithMembers();
    const c = agent(app);
    await signIn(c, owner.email);
    const res = await c.get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
