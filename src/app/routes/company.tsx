import { useMe } from '@/features/auth/api/get-me';
import { CompanyScreen } from '@/features/companies';
import { EmptyState } from '@/components/ui/states';

/** The signed-in admin's company. Anyone else is told whose page it is, not shown an error. */
export function Component() {
  const me = useMe();
  return (
    <div className="mx-auto max-w-7xl px-4 pt-4 pb-10">
      <title>{`${me.company?.name ?? 'Company'} · Tallyard`}</title>
      {me.isAdmin && me.company ? (
        <CompanyScreen companyId={me.company.id} />
      ) : (
        <EmptyState title="The company page is for its admins">
          Ask an admin of your company to change its people or send invitations.
        </EmptyState>
      )}
    </div>
  );
}
