import type { SessionUserDto } from '@shared/schemas/auth';

declare global {
  namespace Express {
    // The signed-in user as passport puts it on the request.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUserDto {}
  }
}

declare module 'express-session' {
  interface SessionData {
    csrfToken?: string;
  }
}

export {};
