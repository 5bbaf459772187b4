import { Mailbox } from '@/features/mailbox/components/mailbox';

export function Component() {
  return (
    <div className="mx-auto max-w-7xl px-4 pt-4 pb-10">
      <title>Mailbox · Tallyard</title>
      <Mailbox />
    </div>
  );
}
