import type { User as UserDto } from '@shared/auth/auth.schema';

declare global {
  namespace Express {
    // passport puts the signed-in user here; it is always the shared DTO, never an entity.
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends UserDto {}
  }
}

declare module 'express-session' {
  interface SessionData {
    /** When the signed-in session began (ms since epoch), for the absolute timeout. */
    signedInAt?: number;
    /** What the browser said it was at sign-in ("Chrome on Android"), for the list of signed-in devices. */
    device?: string | null;
    csrfToken?: string;
  }
}

export {};
