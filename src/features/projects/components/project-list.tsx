import { Link } from 'react-router';
import { Table, TableBody, TableCell, TableHead, TableHeaderCell, TableRow } from '@/components/ui/table';
import { formatMoney } from '@/lib/format';
import type { ProjectSummaryView } from '@/shared/schemas/project';
import { RoleBadges } from './role-badges';

/** The Jobs table: one row per project the signed-in person is on. */
export function ProjectList({ projects }: { projects: readonly ProjectSummaryView[] }) {
  return (
    <Table aria-label="Jobs">
      <TableHead>
        <tr>
          <TableHeaderCell>Job</TableHeaderCell>
          <TableHeaderCell>Location</TableHeaderCell>
          <TableHeaderCell>Contract no.</TableHeaderCell>
          <TableHeaderCell>My roles</TableHeaderCell>
          <TableHeaderCell className="text-right">Bid items</TableHeaderCell>
          <TableHeaderCell className="text-right">Contract sum</TableHeaderCell>
        </tr>
      </TableHead>
      <TableBody>
        {projects.map((project) => (
          <TableRow key={project.id}>
            <TableCell>
              <Link
                to={`/projects/${project.id}`}
                className="font-medium text-spruce-800 underline-offset-2 hover:underline"
              >
                {project.name}
              </Link>
            </TableCell>
            <TableCell className="text-stone-700">{project.location || '—'}</TableCell>
            <TableCell className="text-stone-700 tabular-nums">{project.contractNumber || '—'}</TableCell>
            <TableCell>
              <RoleBadges roles={project.myRoles} />
            </TableCell>
            <TableCell className="num">{project.bidItemCount}</TableCell>
            <TableCell className="num font-medium">{formatMoney(project.contractSumCents)}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
