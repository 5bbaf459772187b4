import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { EmptyState } from '@/components/ui/states';
import { formatMoney, formatPercentBps } from '@/lib/format';
import { COMPANY_KIND_LABELS, UNIT_SYSTEM_LABELS } from '@/lib/labels';
import type { ProjectView } from '@/shared/schemas/project';
import { PeopleTable } from './people-table';
import { Stat } from './stat';

/** The Overview tab: headline figures, the three companies, contract terms and the people. */
export function ProjectOverview({ project }: { project: ProjectView }) {
  const { subcontractor, generalContractor, owner } = project.companies;
  return (
    <div className="flex flex-col gap-5">
      <dl className="grid grid-cols-2 gap-3 md:grid-cols-4">
        <Stat
          label="Original contract sum"
          value={formatMoney(project.originalContractSumCents)}
          note="Bid schedule as set up"
        />
        <Stat
          label="Approved change orders"
          value={`${project.approvedChangesCents > 0 ? '+' : ''}${formatMoney(project.approvedChangesCents)}`}
          note="Net of approved change orders"
        />
        <Stat
          label="Current contract sum"
          value={formatMoney(project.contractSumCents)}
          note={project.contractLocked ? 'Locked: changes by change order only' : 'Contract being set up'}
        />
        <Stat
          label="Earned to date"
          value={formatMoney(project.money.earnedToDateCents)}
          note="Latest certified pay app"
        />
        <Stat label="Retainage held" value={formatMoney(project.money.retainageHeldCents)} note="Withheld to date" />
        <Stat label="Paid to date" value={formatMoney(project.money.paidToDateCents)} note="Settled payments" />
        <Stat label="Bid items" value={project.bidItemCount} />
        <Stat label="Retainage" value={formatPercentBps(project.retainageBps)} note="Withheld per line" />
        <Stat
          label="Variation band"
          value={`+${formatPercentBps(project.bandOverBps)} / −${formatPercentBps(project.bandUnderBps)}`}
          note="Beyond it, unit prices may be renegotiated"
        />
      </dl>
      <div className="grid gap-4 md:grid-cols-2">
        <Card>
          <CardHeader>
            <CardTitle>Companies</CardTitle>
          </CardHeader>
          <CardBody>
            <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2">
              {[generalContractor, subcontractor, owner].map((company) => (
                <div key={company.id} className="contents">
                  <dt className="text-stone-600">{COMPANY_KIND_LABELS[company.kind]}</dt>
                  <dd className="font-medium">{company.name}</dd>
                </div>
              ))}
            </dl>
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>Contract terms</CardTitle>
          </CardHeader>
          <CardBody>
            <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2">
              <dt className="text-stone-600">Contract number</dt>
              <dd className="tabular-nums">{project.contractNumber || '—'}</dd>
              <dt className="text-stone-600">Location</dt>
              <dd>{project.location || '—'}</dd>
              <dt className="text-stone-600">Units</dt>
              <dd>{UNIT_SYSTEM_LABELS[project.units]}</dd>
              <dt className="text-stone-600">Payment terms</dt>
              <dd className="tabular-nums">{project.paymentTermsDays} days</dd>
              <dt className="text-stone-600">Processing fees</dt>
              <dd>
                {project.processingFeeBearer === 'payer'
                  ? 'Added to the payment (the payer bears them)'
                  : 'Absorbed by the payee'}
              </dd>
            </dl>
          </CardBody>
        </Card>
      </div>
      <section aria-labelledby="overview-people" className="flex flex-col gap-2">
        <h2 id="overview-people" className="text-sm font-semibold">
          People and roles
        </h2>
        {project.members.length ? (
          <PeopleTable members={project.members} />
        ) : (
          <EmptyState title="Nobody is on this job yet" />
        )}
      </section>
    </div>
  );
}
