import { RefreshCw } from 'lucide-react';
import { useState } from 'react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { PageHeader } from '@/components/ui/page-header';
import { EmptyState, ErrorState, LoadingState } from '@/components/ui/states';
import { cn } from '@/lib/cn';
import { useMailbox, type CaughtMail } from '../api/get-mailbox';

const when = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'medium' });

const SUBTITLES = {
  development:
    'Development only: mail addressed to you that this server caught in its local SMTP sink instead of delivering it. Kept in memory until the server restarts.',
  demo: 'This is a demo: it sends no real e-mail. Mail addressed to you (invitations, pay application notices, password links) lands here instead, until the demo restarts.',
} as const;

/** The signed-in person's own caught e-mail, newest first, with its text and HTML (development and the demo). */
export function Mailbox() {
  const mailbox = useMailbox();
  const [selectedId, setSelectedId] = useState<number | null>(null);
  const refresh = (
    <Button variant="secondary" onClick={() => void mailbox.refetch()} disabled={mailbox.isFetching}>
      <RefreshCw aria-hidden />
      Refresh
    </Button>
  );
  const kind = mailbox.data?.kind ?? 'development';
  const header = (
    <PageHeader title={kind === 'demo' ? 'Demo mailbox' : 'Mailbox'} subtitle={SUBTITLES[kind]} actions={refresh} />
  );
  if (mailbox.isPending)
    return (
      <>
        {header}
        <LoadingState label="Loading caught mail…" />
      </>
    );
  if (mailbox.isError)
    return (
      <>
        {header}
        <ErrorState error={mailbox.error} title="No development mailbox here" />
      </>
    );
  const messages = mailbox.data.messages;
  const selected = messages.find((m) => m.id === selectedId) ?? messages[0];
  return (
    <>
      {header}
      {messages.length === 0 || !selected ? (
        <EmptyState title="No mail for you yet">
          Invitations, pay application notices and password links addressed to you appear here as they are sent.
        </EmptyState>
      ) : (
        <div className="grid gap-4 md:grid-cols-[20rem_1fr]">
          <Card className="max-h-[70vh] overflow-y-auto">
            <ul aria-label="Caught messages" className="divide-y divide-stone-100">
              {messages.map((m) => (
                <li key={m.id}>
                  <button
                    type="button"
                    aria-current={m.id === selected.id}
                    onClick={() => setSelectedId(m.id)}
                    className={cn(
                      'w-full px-3 py-2 text-left hover:bg-stone-50',
                      m.id === selected.id && 'bg-spruce-50',
                    )}
                  >
                    <span className="block truncate text-sm font-medium text-stone-900">
                      {m.subject || '(no subject)'}
                    </span>
                    <span className="block truncate text-xs text-stone-600">To {m.to.join(', ')}</span>
                    <span className="block text-xs text-stone-500">{when.format(new Date(m.receivedAt))}</span>
                  </button>
                </li>
              ))}
            </ul>
          </Card>
          <MessageView message={selected} />
        </div>
      )}
    </>
  );
}

function MessageView({ message }: { message: CaughtMail }) {
  const [view, setView] = useState<'html' | 'text'>('html');
  return (
    <Card className="flex min-h-[24rem] flex-col">
      <div className="border-b border-stone-200 px-4 py-3 text-sm">
        <h2 className="font-semibold text-stone-900">{message.subject}</h2>
        <p className="text-xs text-stone-600">
          From {message.from} · to {message.to.join(', ')}
        </p>
        <div role="group" aria-label="Show as" className="mt-2 flex gap-1">
          {(['html', 'text'] as const).map((v) => (
            <Button
              key={v}
              size="sm"
              variant={view === v ? 'primary' : 'secondary'}
              aria-pressed={view === v}
              onClick={() => setView(v)}
            >
              {v === 'html' ? 'Formatted' : 'Plain text'}
            </Button>
          ))}
        </div>
      </div>
      {view === 'html' && message.html ? (
        // sandbox without scripts: the caught HTML is shown, never run
        <iframe title="Message" sandbox="" srcDoc={message.html} className="min-h-[28rem] w-full flex-1 bg-white" />
      ) : (
        <pre className="flex-1 overflow-auto px-4 py-3 font-sans text-sm whitespace-pre-wrap text-stone-800">
          {message.text}
        </pre>
      )}
    </Card>
  );
}
