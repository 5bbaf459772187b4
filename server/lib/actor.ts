import type { Response } from 'express';
import type { CompanyKind } from '../../src/shared/constants';
import { unauthorized } from './app-error';

/** The signed-in person a request acts for. */
export type Actor = {
  userId: string;
  name: string;
  email: string;
  companyId: string | null;
  companyKind: CompanyKind | null;
  companyName: string | null;
  isAdmin: boolean;
};

export function getActor(res: Response): Actor {
  const actor = res.locals.actor as Actor | undefined;
  if (!actor) throw unauthorized();
  return actor;
}
