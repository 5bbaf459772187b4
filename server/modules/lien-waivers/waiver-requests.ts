import type { Executor } from '../../db/client';
import { enqueueEmail } from '../notifications/outbox';
import { seatAddresses } from '../members/members.repository';
import type { ProjectParties } from '../../../src/shared/policies/projects';
import { waiverOptions } from '../../../src/shared/policies/lien-waivers';
import { listWaivers, paymentsOf } from './lien-waivers.repository';
import { waiverRequestedMail } from './waiver-emails';

type App = Parameters<typeof waiverOptions>[0] & { id: string; number: number };

/**
 * Asks the subcontractor by e-mail for the waiver of `form` that the waiver policy (`waiverOptions`) now allows, if
 * it allows one: the conditional waiver when the application is certified, the unconditional one when a payment
 * settles. Inside the transaction of that step; the caller runs it once per step.
 */
export async function queueWaiverRequest(
  tx: Executor,
  ctx: { appUrl: string },
  project: ProjectParties & { id: string; name: string },
  app: App,
  form: 'conditional' | 'unconditional',
) {
  const due = waiverOptions(app, await paymentsOf(tx, app.id), await listWaivers(tx, { payAppId: app.id })).find(
    (o) => o.allowed && o.kind.startsWith(form),
  );
  if (!due || due.amountCents <= 0) return;
  // The subcontractor's seat while its holder still works for the subcontractor (as access counts it).
  const to = await seatAddresses(tx, project, ['subcontractor']);
  await enqueueEmail(
    tx,
    waiverRequestedMail({ appUrl: ctx.appUrl, project, payAppNumber: app.number }, to, due.kind, due.amountCents),
  );
}
