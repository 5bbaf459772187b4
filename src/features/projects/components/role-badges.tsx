import { Badge } from '@/components/ui/badge';
import { ROLE_LABELS, ROLE_TONES } from '@/lib/labels';
import type { AccessRole } from '@/shared/constants';

export function RoleBadges({ roles }: { roles: readonly AccessRole[] }) {
  if (roles.length === 0) return <span className="text-stone-500">None</span>;
  return (
    <span className="inline-flex flex-wrap gap-1">
      {roles.map((role) => (
        <Badge key={role} tone={ROLE_TONES[role]}>
          {ROLE_LABELS[role]}
        </Badge>
      ))}
    </span>
  );
}
