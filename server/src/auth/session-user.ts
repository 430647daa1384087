import type { CurrentUser } from '@cc/shared';

// passport puts the deserialised user on req.user; this is its shape everywhere in the server.
declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends CurrentUser {}
  }
}

export {};
