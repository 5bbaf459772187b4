import { Link } from 'react-router';
import { Badge } from '@/components/ui/badge';
import { Card, CardBody, CardHeader, CardTitle } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatDate } from '@/lib/format';
import { COMPANY_KIND_LABELS, ROLE_LABELS } from '@/lib/labels';
import type { CompanyPageView } from '@/shared/schemas/project';
import { useCompanyPage } from '../api/get-company-page';

const linkClass = 'text-spruce-800 underline-offset-2 hover:underline';

/**
 * The company page for its admins: who is in the company, which seat each holds on which job (people are added to
 * and removed from a job on that job's People tab), and the invitations to the company's seats still open.
 */
export function CompanyScreen({ companyId }: { companyId: string }) {
  const page = useCompanyPage(companyId);
  if (page.isPending) return <LoadingState label="Opening the company…" />;
  if (page.isError) return <ErrorState error={page.error} title="The company page cannot be shown" />;
  const { company, people, invitations } = page.data;
  return (
    <>
      <PageHeader
        title={company.name}
        subtitle={`${COMPANY_KIND_LABELS[company.kind]} · ${people.length} ${people.length === 1 ? 'person' : 'people'}`}
      />
      <div className="flex flex-col gap-6">
        <Card>
          <CardHeader>
            <CardTitle>People</CardTitle>
          </CardHeader>
          <CardBody>
            <PeopleOfCompany people={people} />
          </CardBody>
        </Card>
        <Card>
          <CardHeader>
            <CardTitle>Open invitations</CardTitle>
          </CardHeader>
          <CardBody>
            <OpenInvitations invitations={invitations} />
          </CardBody>
        </Card>
      </div>
    </>
  );
}

function PeopleOfCompany({ people }: { people: CompanyPageView['people'] }) {
  return (
    <Table aria-label="People of the company">
      <TableHead>
        <tr>
          <TableHeaderCell>Name</TableHeaderCell>
          <TableHeaderCell>E-mail</TableHeaderCell>
          <TableHeaderCell>Seats on jobs</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {people.map((person) => (
          <TableRow key={person.userId}>
            <TableCell className="font-medium whitespace-nowrap">
              {person.name} {person.isAdmin ? <Badge tone="spruce">admin</Badge> : null}
            </TableCell>
            <TableCell>
              <a href={`mailto:${person.email}`} className={linkClass}>
                {person.email}
              </a>
            </TableCell>
            <TableCell className="min-w-72">
              {person.seats.length === 0 ? (
                <span className="text-stone-500">No job yet</span>
              ) : (
                <ul className="flex flex-col gap-0.5">
                  {person.seats.map((seat) => (
                    <li key={seat.projectId}>
                      <Link to={`/projects/${seat.projectId}/people`} className={linkClass}>
                        {seat.projectName}
                      </Link>
                      <span className="text-stone-600"> · {ROLE_LABELS[seat.role]}</span>
                    </li>
                  ))}
                </ul>
              )}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

function OpenInvitations({ invitations }: { invitations: CompanyPageView['invitations'] }) {
  if (invitations.length === 0) {
    return (
      <EmptyState title="No invitation is waiting">
        Invite people to a job from that job&apos;s People tab; the invitation shows here until it is accepted.
      </EmptyState>
    );
  }
  return (
    <Table aria-label="Open invitations">
      <TableHead>
        <tr>
          <TableHeaderCell>E-mail</TableHeaderCell>
          <TableHeaderCell>Job and seat</TableHeaderCell>
          <TableHeaderCell>Invited by</TableHeaderCell>
          <TableHeaderCell>Sent</TableHeaderCell>
          <TableHeaderCell>Link works until</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {invitations.map((inv) => (
          <TableRow key={inv.id}>
            <TableCell className="font-medium">{inv.email}</TableCell>
            <TableCell>
              <Link to={`/projects/${inv.projectId}/people`} className={linkClass}>
                {inv.projectName}
              </Link>
              <span className="text-stone-600"> · {ROLE_LABELS[inv.role]}</span>
            </TableCell>
            <TableCell>{inv.invitedBy}</TableCell>
            <TableCell className="whitespace-nowrap">{formatDate(inv.sentAt)}</TableCell>
            <TableCell className="whitespace-nowrap">
              {inv.expired ? (
                <Badge tone="brick">expired {formatDate(inv.expiresAt)}</Badge>
              ) : (
                formatDate(inv.expiresAt)
              )}
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
