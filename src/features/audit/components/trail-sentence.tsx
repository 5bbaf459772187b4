import { Link } from 'react-router';
import type { AuditEventView } from '@/shared/schemas/audit';

/** The event's sentence with the object's name as a link to it (plain text where it has no page). */
export function TrailSentence({ event }: { event: AuditEventView }) {
  const [head = '', tail = ''] = event.sentence.split('{object}');
  const { label, href } = event.object;
  return (
    <span>
      {head}
      {href ? (
        <Link to={href} className="font-medium text-spruce-800 underline-offset-2 hover:underline">
          {label}
        </Link>
      ) : (
        <span className="font-medium">{label}</span>
      )}
      {tail}
    </span>
  );
}
