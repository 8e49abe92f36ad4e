import type { Response } from 'express';
import type { Role } from '@millrace/contracts';

/** The signed-in person as the request pipeline knows them. */
export interface SignedInPerson {
  id: number;
  email: string;
  name: string;
  role: Role;
}

export interface RequestAuth {
  person: SignedInPerson | null;
  sessionId: string | null;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      auth?: RequestAuth;
    }
  }
}

/** The signed-in person of a guarded route (the guard has already answered 401 otherwise). */
export function currentPerson(res: Response): SignedInPerson {
  const person = res.locals.auth?.person;
  if (!person) throw new Error('currentPerson(res) used on a route without allow(...)');
  return person;
}
