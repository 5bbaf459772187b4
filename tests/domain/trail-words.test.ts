import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { trailChanges, trailSentence, WORDED_ACTIONS } from '../../src/shared/trail-words';

// The trail reads as sentences in the product's words (issue 14): no id, hash or field code reaches the screen.
// Each recorded event kind below carries the before/after shape its service writes (server/modules/*).
const ID = '7fae5167-6032-4069-9d5c-360c1040422e';
const SHA = 'a4b9110aec6fbf21b5b8624641c8a12f843695db3ab055742730b5efbbb09ede';

const SAMPLES: Record<string, { before?: unknown; after?: unknown; expect: RegExp }> = {
  'project.created': { after: { name: 'Millbrook', retainageBps: 500 }, expect: /^Dana set up \{object\}$/ },
  'project.updated': {
    before: { retainageBps: 1000 },
    after: { retainageBps: 500 },
    expect: /changed the contract settings/,
  },
  'demo.seeded': { after: { bidItems: 16 }, expect: /loaded the demo into \{object\} with 16 bid items/ },
  'bid_item.created': {
    after: { itemNumber: '203', unitPriceCents: 725, payUnit: 'CY', contractQuantity: 21000, bidItemId: ID },
    expect: /added \{object\} at \$7\.25 per CY, 21,000\.00 CY in the contract/,
  },
  'bid_item.updated': { before: { unitPriceCents: 725 }, after: { unitPriceCents: 810 }, expect: /changed \{object\}/ },
  'bid_item.deleted': { before: { itemNumber: '9' }, expect: /removed \{object\} from the bid schedule/ },
  'bid_item.imported': { after: { count: 12, ids: [ID] }, expect: /imported 12 bid items into \{object\}/ },
  'change_order.proposed': { after: { title: 'Extra rock' }, expect: /proposed \{object\}/ },
  'change_order.drafted_from_watch': { after: { title: 'Band' }, expect: /drafted \{object\} from the quantity watch/ },
  'change_order.gc_approved': { expect: /approved \{object\} for the general contractor/ },
  'change_order.owner_approved': { expect: /approved \{object\} for the owner/ },
  'change_order.approved': {
    after: { applied: [{ bidItemId: ID }] },
    expect: /approved \{object\}; it now applies to the bid schedule/,
  },
  'change_order.rejected': { after: { note: 'No' }, expect: /rejected \{object\}/ },
  'change_order.documents_attached': {
    after: { files: [{ id: ID, fileName: 'survey.pdf', sizeBytes: 10, sha256: SHA }] },
    expect: /attached 1 document to \{object\}/,
  },
  'forecast.updated': {
    after: { forecastQuantity: 21700, itemNumber: '203' },
    expect: /set the forecast at completion of \{object\} to 21,700\.00 CY/,
  },
  'invitation.sent': {
    after: { email: 'x@example.test', role: 'general_contractor' },
    expect: /sent \{object\} to join as general contractor/,
  },
  'invitation.revoked': { before: { email: 'x@example.test' }, expect: /withdrew \{object\}/ },
  'invitation.accepted': { after: { role: 'owner', userId: ID }, expect: /accepted \{object\} and joined as owner/ },
  'tally.created': {
    after: { quantity: 1250.5, bidItemId: ID, inputs: null },
    expect: /measured \{object\}: 1,250\.50 CY/,
  },
  'tally.updated': { before: { quantity: 1 }, after: { quantity: 2 }, expect: /changed \{object\}/ },
  'tally.deleted': { before: { title: 'x' }, expect: /deleted \{object\}/ },
  'tally.ready': {
    before: { status: 'draft' },
    after: { status: 'ready', quantity: 1 },
    expect: /marked \{object\} ready to bill at 1\.00 CY/,
  },
  'tally.evidence_added': {
    after: { files: [{ id: ID, sha256: SHA, fileName: 'grid.csv' }] },
    expect: /attached 1 evidence file to \{object\}/,
  },
  'tally.evidence_removed': { before: { fileName: 'grid.csv' }, expect: /removed an evidence file from \{object\}/ },
  'pay_app.created': {
    after: { number: 1, periodStart: '2026-08-01', periodEnd: '2026-08-31', tallyIds: [ID] },
    expect: /started \{object\} for 2026-08-01 to 2026-08-31/,
  },
  'pay_app.submitted': {
    before: { status: 'draft' },
    after: { status: 'submitted', currentDueCents: 10073641 },
    expect: /submitted \{object\}, \$100,736\.41 due/,
  },
  'pay_app.reviewed': {
    after: {
      lines: [
        { lineId: ID, decision: 'approve' },
        { lineId: ID, decision: 'dispute' },
      ],
    },
    expect: /reviewed \{object\}: 1 line approved, 1 line disputed/,
  },
  'pay_app.returned': {
    before: { status: 'in_review' },
    after: { status: 'returned' },
    expect: /returned \{object\} with its disputes/,
  },
  'pay_app.revised': { after: { status: 'draft', revision: 1 }, expect: /revised \{object\} \(revision 1\)/ },
  'pay_app.certified': {
    before: { status: 'in_review', currentDueCents: 10073641 },
    after: { status: 'certified', currentDueCents: 10073641, certifiedAt: '2026-09-05T10:00:00Z' },
    expect: /certified \{object\} for payment, \$100,736\.41 due/,
  },
  'dispute.commented': { after: { commentId: ID, body: 'See the tickets' }, expect: /commented on \{object\}/ },
  'payment.created': {
    after: { amountCents: 2509609, payAppId: ID, balanceCents: 2509609 },
    expect: /started \{object\} of \$25,096\.09/,
  },
  'payment.checkout_opened': {
    after: { stripeCheckoutSessionId: 'cs_test_123' },
    expect: /opened the checkout of \{object\}/,
  },
  'payment.canceled': {
    before: { status: 'created' },
    after: { status: 'canceled' },
    expect: /closed \{object\} unpaid/,
  },
  'payment.succeeded': {
    after: { amountCents: 10073641, method: 'us_bank_account', status: 'succeeded', payAppId: ID },
    expect: /recorded \{object\} of \$100,736\.41 as received/,
  },
  'payment.failed': { after: { status: 'failed' }, expect: /recorded \{object\} as failed/ },
  'payment.receipt': { after: { to: 'x' }, expect: /sent the receipt of \{object\}/ },
  'payment.event_rejected': {
    after: { stripeEventId: 'evt_1' },
    expect: /refused a processor message about \{object\}/,
  },
  'lien_waiver.issued': {
    after: { kind: 'conditional_progress', amountCents: 2509609, signedName: 'Rosa Delgado' },
    expect: /signed and issued \{object\} for \$25,096\.09/,
  },
  'email.failed': { after: { error: 'refused' }, expect: /could not deliver \{object\}/ },
  'account.admin_created': {
    after: { email: 'a@b.test', companyName: 'Cascade Grading', companyId: ID, isAdmin: true },
    expect: /made \{object\} the first administrator of Cascade Grading/,
  },
  'member.removed': {
    before: { role: 'owner' },
    after: { sessionsEnded: 2 },
    expect: /^Dana removed \{object\} from the job$/,
  },
  'company_member.removed': {
    after: { sessionsEnded: 1 },
    expect: /removed \{object\} from the company and ended their sessions/,
  },
  'dispute.edited': {
    before: { reason: 'Short', counterQuantity: 500 },
    after: { reason: 'Tickets 41-44 are for the north haul', counterQuantity: 480 },
    expect: /changed \{object\}: counter quantity 480\.00 CY/,
  },
  'dispute.withdrawn': { after: { status: 'resolved', note: 'Counted again' }, expect: /withdrew \{object\}/ },
  'measurement_profile.set': { after: { kind: 'weight' }, expect: /set how \{object\} is measured and paid/ },
  'lump_sum_stages.set': {
    after: {
      stages: [
        { name: 'Clearing', percentOfItem: 40, completedOn: '2026-03-02' },
        { name: 'Final grading', percentOfItem: 60, completedOn: null },
      ],
    },
    expect: /set the stage schedule of \{object\}: 2 stages, 1 done/,
  },
  'truck.registered': { after: { name: 'T-12' }, expect: /registered \{object\} for truck tickets/ },
  'truck_ticket.added': { after: { quantity: 12 }, expect: /added \{object\}/ },
  'truck_tickets.imported': {
    after: { bidItemId: ID, tickets: 48, flagged: 2 },
    expect: /imported 48 truck tickets into \{object\}, 2 tickets flagged for a look/,
  },
  'material_source.added': { after: { name: 'North pit' }, expect: /added \{object\} as a material source/ },
  'scale_ticket.added': { after: { ticketNumber: 'S-1' }, expect: /added \{object\}/ },
  'force_account_sheet.added': {
    after: { description: 'Muck' },
    expect: /recorded \{object\}, a time-and-materials day/,
  },
  'force_account_sheet.signed': { expect: /signed \{object\} for the general contractor/ },
  'stored_material.added': {
    after: { kind: 'added', quantity: 40, movedOn: '2026-05-12' },
    expect: /recorded 40\.00 CY delivered to storage for \{object\}/,
  },
  'stored_material.used': {
    after: { kind: 'used', quantity: 12 },
    expect: /recorded 12\.00 CY taken from storage and built in/,
  },
  'pay_adjustment.added': {
    after: { amountCents: 570000, description: 'Late' },
    expect: /recorded \{object\}, \$5,700\.00/,
  },
};

/** What must never reach a reader: ids, hashes, processor ids, field codes in camelCase or snake_case. */
const RAW = [
  /[0-9a-f]{8}-[0-9a-f]{4}/i,
  /[0-9a-f]{32}/i,
  /\b(cs|evt|pi)_/,
  /\b[a-z]+[A-Z][a-zA-Z]*\b/,
  /\b[a-z]+_[a-z_]+\b/,
];

describe('trail sentences', () => {
  it('has a sample for every worded event kind, and words every sample', () => {
    expect(Object.keys(SAMPLES).sort()).toEqual([...WORDED_ACTIONS].sort());
  });

  for (const [action, sample] of Object.entries(SAMPLES)) {
    it(`${action}: a sentence with who and the object, and changes free of ids and field codes`, () => {
      const objectType = action.split('.')[0]!;
      const sentence = trailSentence(
        { objectType, action, before: sample.before ?? null, after: sample.after ?? null, actorName: 'Dana' },
        'CY',
      );
      expect(sentence).toMatch(/^Dana /);
      expect(sentence).toMatch(sample.expect);
      const changes = trailChanges(sample.before ?? null, sample.after ?? null, 'CY');
      for (const text of [sentence.replace('{object}', ''), ...changes.flatMap((c) => [c.field, c.before, c.after])]) {
        for (const raw of RAW) expect(text, `${action}: ${text}`).not.toMatch(raw);
      }
    });
  }

  it('shows money, rates, quantities and statuses with their units, before and after', () => {
    expect(
      trailChanges(
        { unitPriceCents: 725, retainageBps: 1000, status: 'in_review' },
        { unitPriceCents: 810, retainageBps: 500, status: 'certified' },
        null,
      ),
    ).toEqual([
      { field: 'Status', before: 'in review', after: 'certified' },
      { field: 'Unit price', before: '$7.25', after: '$8.10' },
      { field: 'Retainage rate', before: '10 %', after: '5 %' },
    ]);
    expect(trailChanges(null, { contractQuantity: 340.5, payUnit: 'LF' }, 'CY')).toEqual([
      { field: 'Pay unit', before: '', after: 'LF' },
      { field: 'Contract quantity', before: '', after: '340.5 LF' },
    ]);
  });

  it('words every event kind the server records (read from server/ source: a new kind needs its sentence here)', () => {
    const recorded = new Set<string>();
    for (const file of readdirSync('server', { recursive: true, encoding: 'utf8' }).filter((f) => f.endsWith('.ts'))) {
      const text = readFileSync(path.join('server', file), 'utf8');
      for (const m of text.matchAll(/action: (?:complete \? )?['`]([a-z_]+\.[a-z_]+)['`]/g)) recorded.add(m[1]!);
      for (const m of text.matchAll(/`([a-z_]+)\.\$\{[^}]+\}`/g)) recorded.add(`${m[1]}.*`);
    }
    expect(recorded.size).toBeGreaterThan(20);
    const missing = [...recorded].filter((a) => !a.endsWith('.*') && !WORDED_ACTIONS.includes(a));
    expect(missing).toEqual([]);
  });

  it('an event kind not worded yet still reads as a sentence, without its code', () => {
    const s = trailSentence(
      { objectType: 'tally', action: 'tally.archived', before: null, after: null, actorName: null },
      null,
    );
    expect(s).toBe('Tallyard recorded “archived” on {object}');
  });
});
