import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import type { ProjectMemberView } from '@/shared/schemas/project';
import { RoleBadges } from './role-badges';

/** Members of a project with their role on it, grouped by person. */
export function PeopleTable({ members }: { members: readonly ProjectMemberView[] }) {
  const people = groupByPerson(members);
  return (
    <Table aria-label="People on this job">
      <TableHead>
        <tr>
          <TableHeaderCell>Name</TableHeaderCell>
          <TableHeaderCell>E-mail</TableHeaderCell>
          <TableHeaderCell>Company</TableHeaderCell>
          <TableHeaderCell>Role on this job</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {people.map((person) => (
          <TableRow key={person.userId}>
            <TableCell className="font-medium">{person.name}</TableCell>
            <TableCell>
              <a href={`mailto:${person.email}`} className="text-spruce-800 underline-offset-2 hover:underline">
                {person.email}
              </a>
            </TableCell>
            <TableCell className="text-stone-700">{person.companyName ?? '—'}</TableCell>
            <TableCell>
              <RoleBadges roles={person.roles} />
            </TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}

type Person = Omit<ProjectMemberView, 'role'> & { roles: ProjectMemberView['role'][] };

function groupByPerson(members: readonly ProjectMemberView[]): Person[] {
  const byUser = new Map<string, Person>();
  for (const { role, ...member } of members) {
    const person = byUser.get(member.userId);
    if (person) person.roles.push(role);
    else byUser.set(member.userId, { ...member, roles: [role] });
  }
  return [...byUser.values()];
}
