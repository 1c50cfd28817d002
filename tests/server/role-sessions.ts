import type { Express } from 'express';
import { roles, type Role } from '@shared/auth/permissions';
import { demoEmail, signedIn } from './test-app';

export type Session = Awaited<ReturnType<typeof signedIn>>;

/** One signed-in session per demo role, with JSON request helpers that send the CSRF token on writes. */
export async function signInEveryRole(app: Express) {
  const sessions = {} as Record<Role, Session>;
  for (const role of roles) sessions[role] = await signedIn(app, demoEmail(role));
  const as = (role: Role) => {
    const session = sessions[role];
    return {
      session,
      get: (url: string) => session.agent.get(url),
      post: (url: string, body: object = {}) => session.agent.post(url).set('X-CSRF-Token', session.csrfToken).send(body),
      patch: (url: string, body: object = {}) => session.agent.patch(url).set('X-CSRF-Token', session.csrfToken).send(body),
      delete: (url: string) => session.agent.delete(url).set('X-CSRF-Token', session.csrfToken),
    };
  };
  return { sessions, as };
}
