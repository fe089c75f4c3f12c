import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, makeTestApp, uniqueEmail, type TestApp } from '../test-app';

/**
 * What a password may be, beyond its length (OWASP ASVS 4.0.3 V2.1): the whole of it counts (2.1.3, no
 * truncation), any Unicode is allowed, spaces and emoji included (2.1.4), and there are no rules on what
 * kinds of characters it must hold (2.1.9).
 */
let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

async function registered(password: string) {
  const email = uniqueEmail();
  const res = await client(t.app).post('/api/auth/register', { email, password, displayName: 'Ola Brennan' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return email;
}
const signIn = (email: string, password: string) => client(t.app).post('/api/auth/login', { email, password });

describe('what a password may be', () => {
  it('when a 128-character password is registered, then only all 128 characters sign in: not its first 72 or 127 (no truncation, ASVS 2.1.3)', async () => {
    const password = Array.from({ length: 128 }, (_, i) => 'gravel kettle '[i % 14]).join('');
    const email = await registered(password);
    // 72 bytes: where bcrypt stops reading (its documented limit); argon2 reads the whole password.
    expect((await signIn(email, password.slice(0, 72))).status).toBe(401);
    expect((await signIn(email, `${password.slice(0, 127)}X`)).status).toBe(401);
    expect((await signIn(email, password)).status).toBe(200);
  });

  it('when the password holds spaces, accents, emoji and other scripts, then it is taken as typed (ASVS 2.1.4)', async () => {
    const password = '🏁 grille à l’aube, 雨の日 🌧';
    const email = await registered(password);
    expect((await signIn(email, password)).status).toBe(200);
    // One character different (a space dropped) is another password.
    expect((await signIn(email, password.replace(' ', ''))).status).toBe(401);
  });

  it('when the password is twelve lower-case letters, then it is accepted: no mix of character kinds is required (ASVS 2.1.9)', async () => {
    const email = await registered('quarrylanepk');
    expect((await signIn(email, 'quarrylanepk')).status).toBe(200);
  });
});
